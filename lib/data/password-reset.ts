/**
 * Password reset by mail: a one-time link valid for an hour, stored only as a hash. Asking answers
 * the same whether or not the address has an account; using the link sets the password and ends
 * every session of the account.
 */
import "server-only";
import { and, asc, eq, gt, isNull } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { memberships, organizations, passwordResetTokens, signInAttempts, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { hashToken, newToken } from "@/lib/auth/tokens";
import { ApiError } from "@/lib/errors";
import { appOrigin } from "@/lib/mail/config";
import type { PasswordResetConfirmInput } from "@/lib/validation/people";
import { endAllSessions } from "./actors";
import { recordAudit } from "./audit";
import { queueMail } from "./mail";

export const RESET_MINUTES = 60;

export const resetLink = (token: string) => `${appOrigin()}/reset-password/${token}`;

/**
 * Queues a reset mail when the address belongs to a member; otherwise does nothing. Returns
 * whether a mail was queued — for the caller's `sendQueuedMail`, never for the answer.
 * An earlier unused link of the account stops working.
 */
export async function requestPasswordReset(email: string, now = new Date()): Promise<boolean> {
  return writeTransaction(async (tx) => {
    const [user] = await tx
      .select({ id: users.id, organizationId: memberships.organizationId })
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .where(eq(users.email, email))
      .limit(1);
    if (!user) return false;
    await tx
      .delete(passwordResetTokens)
      .where(and(eq(passwordResetTokens.userId, user.id), isNull(passwordResetTokens.usedAt)));
    const { token, hash } = newToken();
    await tx.insert(passwordResetTokens).values({
      userId: user.id,
      tokenHash: hash,
      expiresAt: new Date(now.getTime() + RESET_MINUTES * 60_000),
    });
    await queueMail(tx, {
      to: email,
      organizationId: user.organizationId,
      mail: { kind: "password-reset", data: { link: resetLink(token), validMinutes: RESET_MINUTES } },
    });
    return true;
  });
}

const LINK_SPENT = () =>
  new ApiError(
    404,
    "not_found",
    "This reset link does not work: it was used already or replaced by a newer one. Ask for a new link.",
  );
const LINK_EXPIRED = () =>
  new ApiError(
    410,
    "gone",
    `This reset link has expired (links work for ${RESET_MINUTES} minutes). Ask for a new one.`,
  );

/** Whether a reset link still works (for the page, before the person types a password). */
export async function resetLinkState(token: string, now = new Date()): Promise<"open" | "expired" | "spent"> {
  const [row] = await getDb()
    .select({ expiresAt: passwordResetTokens.expiresAt, usedAt: passwordResetTokens.usedAt })
    .from(passwordResetTokens)
    .where(eq(passwordResetTokens.tokenHash, hashToken(token)));
  if (!row || row.usedAt) return "spent";
  return row.expiresAt.getTime() <= now.getTime() ? "expired" : "open";
}

/**
 * Sets the new password, spends the link, and ends every session of the account (a session an
 * intruder may hold included). Returns the address to sign in with.
 */
export async function confirmPasswordReset(input: PasswordResetConfirmInput, now = new Date()) {
  // Checked before the (deliberately slow) hashing, so a dead link costs the server nothing.
  const state = await resetLinkState(input.token, now);
  if (state === "spent") throw LINK_SPENT();
  if (state === "expired") throw LINK_EXPIRED();
  const passwordHash = await hashPassword(input.password);
  return writeTransaction(async (tx) => {
    const [row] = await tx
      .select({
        id: passwordResetTokens.id,
        userId: passwordResetTokens.userId,
        expiresAt: passwordResetTokens.expiresAt,
        usedAt: passwordResetTokens.usedAt,
        email: users.email,
      })
      .from(passwordResetTokens)
      .innerJoin(users, eq(users.id, passwordResetTokens.userId))
      .where(eq(passwordResetTokens.tokenHash, hashToken(input.token)));
    if (!row || row.usedAt) throw LINK_SPENT();
    if (row.expiresAt.getTime() <= now.getTime()) throw LINK_EXPIRED();
    const spent = await tx
      .update(passwordResetTokens)
      .set({ usedAt: now })
      .where(
        and(
          eq(passwordResetTokens.id, row.id),
          isNull(passwordResetTokens.usedAt),
          gt(passwordResetTokens.expiresAt, now),
        ),
      )
      .returning({ id: passwordResetTokens.id });
    if (spent.length === 0) throw LINK_SPENT();
    await tx.update(users).set({ passwordHash }).where(eq(users.id, row.userId));
    await endAllSessions(row.userId, tx);
    // The person proved they hold the mailbox: earlier typos no longer hold the account back.
    await tx.delete(signInAttempts).where(eq(signInAttempts.email, row.email));
    // Recorded in the organisation the account acts in (the one joined first); never the token.
    const [home] = await tx
      .select({
        organizationId: memberships.organizationId,
        organizationName: organizations.name,
        role: memberships.role,
        name: users.name,
      })
      .from(memberships)
      .innerJoin(organizations, eq(organizations.id, memberships.organizationId))
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.userId, row.userId))
      .orderBy(asc(memberships.createdAt), asc(memberships.id))
      .limit(1);
    if (home)
      await recordAudit(
        tx,
        { ...home, userId: row.userId, email: row.email, athleteId: null },
        { action: "password.reset", entity: { type: "user", id: row.userId } },
      );
    return { email: row.email };
  });
}
