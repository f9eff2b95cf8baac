/**
 * Invitations: the owner invites a person by e-mail with a role (an athlete invitation claims an
 * existing athlete record). The mailed link carries a one-time token; only its hash is stored.
 * A link works once, for 7 days; sending it again replaces the token, so the old link stops working.
 */
import "server-only";
import { and, asc, desc, eq, gt, isNull, lte, notInArray, sql } from "drizzle-orm";
import { getDb, type Reader, type Transaction, writeTransaction } from "@/db/client";
import { athletes, invitations, memberships, organizations, users } from "@/db/schema";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { hashToken, newToken } from "@/lib/auth/tokens";
import type { Role } from "@/lib/domain";
import { ApiError, conflict, invalidInput, notFound } from "@/lib/errors";
import { appOrigin } from "@/lib/mail/config";
import type { InvitationAcceptInput, InvitationCreateInput } from "@/lib/validation/people";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { isUniqueViolation } from "./errors";
import { queueMail } from "./mail";

export const INVITATION_DAYS = 7;
const INVITATION_MS = INVITATION_DAYS * 24 * 60 * 60_000;

const ROLE_IN_MAIL: Record<Role, string> = {
  owner: "an owner",
  scientist: "a sport scientist",
  coach: "a coach",
  athlete: "an athlete",
};

/** A moment as the mail words it: unambiguous wherever the reader is. */
const mailMoment = (at: Date) =>
  `${at.toLocaleString("en-GB", { dateStyle: "long", timeStyle: "short", timeZone: "UTC" })} UTC`;

export const invitationLink = (token: string) => `${appOrigin()}/invitations/${token}`;

const columns = {
  id: invitations.id,
  email: invitations.email,
  role: invitations.role,
  athleteId: invitations.athleteId,
  athleteName: athletes.name,
  invitedByName: users.name,
  expiresAt: invitations.expiresAt,
  createdAt: invitations.createdAt,
};

type Row = { expiresAt: Date; createdAt: Date } & Omit<
  Record<keyof typeof columns, unknown>,
  "expiresAt" | "createdAt"
>;

function view<R extends Row>(row: R, now = Date.now()) {
  return {
    ...row,
    expiresAt: row.expiresAt.getTime(),
    createdAt: row.createdAt.getTime(),
    expired: row.expiresAt.getTime() <= now,
  };
}

function selectInvitations(reader: Pick<Transaction, "select">, actor: Actor) {
  return reader
    .select(columns)
    .from(invitations)
    .leftJoin(athletes, eq(athletes.id, invitations.athleteId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.organizationId, actor.organizationId), isNull(invitations.acceptedAt)))
    .$dynamic();
}

/** Invitations not yet accepted (expired ones too, so they can be sent again), newest first. */
export async function listInvitations(actor: Actor) {
  const rows = await selectInvitations(getDb(), actor).orderBy(desc(invitations.createdAt), desc(invitations.id));
  const now = Date.now();
  return rows.map((row) => view(row, now));
}

export type InvitationItem = Awaited<ReturnType<typeof listInvitations>>[number];

/**
 * Athletes an invitation may claim: in the organisation, not archived, without an account, and
 * without an invitation already on its way.
 */
export async function listClaimableAthletes(actor: Actor) {
  const waiting = getDb()
    .select({ id: sql<number>`coalesce(${invitations.athleteId}, 0)` })
    .from(invitations)
    .where(
      and(
        eq(invitations.organizationId, actor.organizationId),
        isNull(invitations.acceptedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    );
  return getDb()
    .select({ id: athletes.id, name: athletes.name, externalId: athletes.externalId })
    .from(athletes)
    .where(
      and(
        eq(athletes.organizationId, actor.organizationId),
        eq(athletes.archived, false),
        isNull(athletes.userId),
        notInArray(athletes.id, waiting),
      ),
    )
    .orderBy(asc(athletes.name));
}

async function oneInvitation(tx: Transaction, actor: Actor, id: number) {
  const [row] = await selectInvitations(tx, actor).where(
    and(eq(invitations.id, id), eq(invitations.organizationId, actor.organizationId), isNull(invitations.acceptedAt)),
  );
  if (!row) throw notFound("Invitation");
  return view(row);
}

async function mailInvitation(
  tx: Transaction,
  actor: Actor,
  invitation: { email: string; role: Role },
  token: string,
  expiresAt: Date,
) {
  await queueMail(tx, {
    to: invitation.email,
    organizationId: actor.organizationId,
    mail: {
      kind: "invitation",
      data: {
        organizationName: actor.organizationName,
        inviterName: actor.name,
        roleLabel: ROLE_IN_MAIL[invitation.role],
        link: invitationLink(token),
        expiresOn: mailMoment(expiresAt),
      },
    },
  });
}

/** Invites a person; the mail is queued with the invitation (send it after the commit). */
export async function createInvitation(actor: Actor, input: InvitationCreateInput, now = new Date()) {
  return writeTransaction(async (tx) => {
    const org = actor.organizationId;
    const [member] = await tx
      .select({ id: users.id })
      .from(users)
      .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.organizationId, org)))
      .where(eq(users.email, input.email));
    if (member) throw conflict(`${input.email} already belongs to a member of ${actor.organizationName}.`);
    const [waiting] = await tx
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(
          eq(invitations.organizationId, org),
          eq(invitations.email, input.email),
          isNull(invitations.acceptedAt),
          gt(invitations.expiresAt, now),
        ),
      );
    if (waiting)
      throw conflict(`An invitation to ${input.email} is already waiting. Send it again or revoke it instead.`, {
        invitationId: waiting.id,
      });
    if (input.role === "athlete") await assertClaimable(tx, actor, input.athleteId!, now);
    // An expired invitation to the same address is replaced by the new one.
    await tx
      .delete(invitations)
      .where(
        and(
          eq(invitations.organizationId, org),
          eq(invitations.email, input.email),
          isNull(invitations.acceptedAt),
          lte(invitations.expiresAt, now),
        ),
      );
    const { token, hash } = newToken();
    const expiresAt = new Date(now.getTime() + INVITATION_MS);
    const [created] = await tx
      .insert(invitations)
      .values({
        organizationId: org,
        email: input.email,
        role: input.role,
        athleteId: input.role === "athlete" ? input.athleteId! : null,
        tokenHash: hash,
        invitedBy: actor.userId,
        expiresAt,
      })
      .returning({ id: invitations.id });
    await mailInvitation(tx, actor, input, token, expiresAt);
    // The audit keeps who was invited and how; never the token.
    await recordAudit(tx, actor, {
      action: "member.invite",
      entity: { type: "invitation", id: created.id },
      after: { email: input.email, role: input.role, athleteId: input.athleteId ?? null },
    });
    return oneInvitation(tx, actor, created.id);
  });
}

async function assertClaimable(tx: Transaction, actor: Actor, athleteId: number, now: Date) {
  const [athlete] = await tx
    .select({ id: athletes.id, name: athletes.name, userId: athletes.userId })
    .from(athletes)
    .where(and(eq(athletes.id, athleteId), eq(athletes.organizationId, actor.organizationId)));
  if (!athlete) throw notFound("Athlete");
  if (athlete.userId !== null) throw conflict(`${athlete.name} already has an account.`);
  const [waiting] = await tx
    .select({ email: invitations.email })
    .from(invitations)
    .where(and(eq(invitations.athleteId, athleteId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)));
  if (waiting) throw conflict(`${athlete.name} already has an invitation waiting (to ${waiting.email}).`);
}

/** A new link for a waiting (or expired) invitation: a new token and 7 more days; the old link stops working. */
export async function resendInvitation(actor: Actor, invitationId: number, now = new Date()) {
  return writeTransaction(async (tx) => {
    const before = await oneInvitation(tx, actor, invitationId);
    if (before.athleteId !== null) {
      const [athlete] = await tx
        .select({ userId: athletes.userId, name: athletes.name })
        .from(athletes)
        .where(eq(athletes.id, before.athleteId));
      if (athlete?.userId != null) throw conflict(`${athlete.name} already has an account.`);
    }
    const { token, hash } = newToken();
    const expiresAt = new Date(now.getTime() + INVITATION_MS);
    await tx
      .update(invitations)
      .set({ tokenHash: hash, expiresAt, invitedBy: actor.userId })
      .where(eq(invitations.id, invitationId));
    await mailInvitation(tx, actor, before, token, expiresAt);
    await recordAudit(tx, actor, {
      action: "member.invite",
      entity: { type: "invitation", id: invitationId },
      after: { email: before.email, role: before.role, athleteId: before.athleteId, resent: true },
    });
    return oneInvitation(tx, actor, invitationId);
  });
}

/** Withdraws a waiting invitation: the row goes, so its link stops working. */
export async function revokeInvitation(actor: Actor, invitationId: number) {
  return writeTransaction(async (tx) => {
    const before = await oneInvitation(tx, actor, invitationId);
    await tx.delete(invitations).where(eq(invitations.id, invitationId));
    await recordAudit(tx, actor, {
      action: "invitation.revoke",
      entity: { type: "invitation", id: invitationId },
      before: { email: before.email, role: before.role, athleteId: before.athleteId },
    });
    return { id: invitationId };
  });
}

const SPENT = () =>
  new ApiError(
    404,
    "not_found",
    "This invitation link does not work any more: it was used, withdrawn, or replaced by a newer mail. Ask for a new invitation.",
  );
const EXPIRED = () =>
  new ApiError(410, "gone", "This invitation has expired. Ask the person who invited you to send it again.");

/**
 * What the accept page shows for a token (public: the token is the only key), or null when the
 * link does not work. `existingAccount`: the address already signs in elsewhere, so the person
 * confirms with that password instead of choosing one.
 */
export async function previewInvitation(token: string, now = Date.now()) {
  const db = getDb();
  const [row] = await db
    .select({
      email: invitations.email,
      role: invitations.role,
      organizationName: organizations.name,
      athleteName: athletes.name,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
    })
    .from(invitations)
    .innerJoin(organizations, eq(organizations.id, invitations.organizationId))
    .leftJoin(athletes, eq(athletes.id, invitations.athleteId))
    .where(eq(invitations.tokenHash, hashToken(token)));
  if (!row || row.acceptedAt) return { state: "spent" as const };
  if (row.expiresAt.getTime() <= now) return { state: "expired" as const, organizationName: row.organizationName };
  const [account] = await db
    .select({ id: users.id })
    .from(users)
    .innerJoin(memberships, eq(memberships.userId, users.id))
    .where(eq(users.email, row.email))
    .limit(1);
  return {
    state: "open" as const,
    email: row.email,
    role: row.role,
    organizationName: row.organizationName,
    athleteName: row.athleteName,
    existingAccount: Boolean(account),
  };
}

export type InvitationPreview = Awaited<ReturnType<typeof previewInvitation>>;

/** The invitation a token opens, if it still works; otherwise the reason it does not. */
async function openInvitation(reader: Reader, token: string, now: Date) {
  const [invitation] = await reader
    .select({
      id: invitations.id,
      organizationId: invitations.organizationId,
      organizationName: organizations.name,
      email: invitations.email,
      role: invitations.role,
      athleteId: invitations.athleteId,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
    })
    .from(invitations)
    .innerJoin(organizations, eq(organizations.id, invitations.organizationId))
    .where(eq(invitations.tokenHash, hashToken(token)));
  if (!invitation || invitation.acceptedAt) throw SPENT();
  if (invitation.expiresAt.getTime() <= now.getTime()) throw EXPIRED();
  return invitation;
}

/**
 * Accepts an invitation: creates the account (or, for an address that already signs in elsewhere,
 * checks its password), the membership, and for an athlete the link to their record; the token is
 * spent in the same transaction. Returns the address to sign in with.
 */
export async function acceptInvitation(input: InvitationAcceptInput, now = new Date()) {
  // Checked before the (deliberately slow) hashing, so a dead link costs the server nothing.
  await openInvitation(getDb(), input.token, now);
  const passwordHash = await hashPassword(input.password);
  try {
    return await writeTransaction(async (tx) => {
      const invitation = await openInvitation(tx, input.token, now);

      const [existing] = await tx
        .select({ id: users.id, name: users.name, passwordHash: users.passwordHash })
        .from(users)
        .where(eq(users.email, invitation.email));
      let userId: number;
      let name = input.name ?? "";
      const nameNeeded = () => invalidInput("Enter your name.", { name: "Enter your name." });
      if (existing) {
        const orgs = await tx
          .select({ organizationId: memberships.organizationId })
          .from(memberships)
          .where(eq(memberships.userId, existing.id));
        if (orgs.some((m) => m.organizationId === invitation.organizationId))
          throw conflict(`You are already a member of ${invitation.organizationName}. Sign in instead.`);
        if (orgs.length > 0) {
          // The address signs in elsewhere: joining takes that account's password, not a new one.
          const ok = existing.passwordHash ? await verifyPassword(input.password, existing.passwordHash) : false;
          if (!ok)
            throw invalidInput("This address already has a Changewise account. Enter its current password to join.", {
              password: "Enter the password you already use for Changewise.",
            });
          name = existing.name;
        } else {
          if (!name) throw nameNeeded();
          // An account left over from an earlier membership: the invitee starts it afresh.
          await tx
            .update(users)
            .set({ name, passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
            .where(eq(users.id, existing.id));
        }
        userId = existing.id;
      } else {
        if (!name) throw nameNeeded();
        const [created] = await tx
          .insert(users)
          .values({ email: invitation.email, name, passwordHash })
          .returning({ id: users.id });
        userId = created.id;
      }
      await tx.insert(memberships).values({ userId, organizationId: invitation.organizationId, role: invitation.role });
      if (invitation.athleteId !== null) {
        const linked = await tx
          .update(athletes)
          .set({ userId })
          .where(
            and(
              eq(athletes.id, invitation.athleteId),
              eq(athletes.organizationId, invitation.organizationId),
              isNull(athletes.userId),
            ),
          )
          .returning({ id: athletes.id });
        if (linked.length === 0)
          throw conflict("That athlete record already has an account. Ask for a new invitation.");
      }
      await tx.update(invitations).set({ acceptedAt: now }).where(eq(invitations.id, invitation.id));
      const newcomer: Actor = {
        userId,
        email: invitation.email,
        name,
        organizationId: invitation.organizationId,
        organizationName: invitation.organizationName,
        role: invitation.role,
        athleteId: invitation.athleteId,
      };
      await recordAudit(tx, newcomer, {
        action: "invitation.accept",
        entity: { type: "invitation", id: invitation.id },
        after: { userId, role: invitation.role },
      });
      return { email: invitation.email };
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict("This account is already linked to an athlete record elsewhere.");
    throw error;
  }
}
