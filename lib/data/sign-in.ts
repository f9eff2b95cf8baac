import "server-only";
import { and, eq, gt, lte, or, sql } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { signInAttempts, users } from "@/db/schema";

export async function findUserCredentials(email: string) {
  const [row] = await getDb()
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      passwordHash: users.passwordHash,
      sessionVersion: users.sessionVersion,
    })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);
  return row ?? null;
}

/** Attempts in the window that are failures or still being checked. */
export type AttemptCounts = { byEmail: number; byAddress: number; byEmailFromAddress: number };

/**
 * Counts recent attempts and, when `allow` says so, records this attempt — in one write
 * transaction, before the password is checked. Writers are serialised, so each of N parallel
 * attempts sees the ones reserved before it, and no more passwords are checked than the limit.
 * Returns the reserved row's id, or null when held.
 */
export async function reserveAttempt(
  email: string,
  address: string,
  window: { since: number; at: number },
  allow: (counts: AttemptCounts) => boolean,
): Promise<number | null> {
  const mine = or(eq(signInAttempts.email, email), eq(signInAttempts.address, address));
  return writeTransaction(async (tx) => {
    // Rows older than the window decide nothing; dropping this caller's keeps the table small.
    await tx.delete(signInAttempts).where(and(lte(signInAttempts.attemptedAt, window.since), mine));
    const [row] = await tx
      .select({
        byEmail: sql<number>`coalesce(sum(case when ${signInAttempts.email} = ${email} then 1 else 0 end), 0)`,
        byAddress: sql<number>`coalesce(sum(case when ${signInAttempts.address} = ${address} then 1 else 0 end), 0)`,
        byEmailFromAddress: sql<number>`coalesce(sum(case when ${signInAttempts.email} = ${email} and ${signInAttempts.address} = ${address} then 1 else 0 end), 0)`,
      })
      .from(signInAttempts)
      .where(and(gt(signInAttempts.attemptedAt, window.since), mine));
    const counts = {
      byEmail: Number(row?.byEmail ?? 0),
      byAddress: Number(row?.byAddress ?? 0),
      byEmailFromAddress: Number(row?.byEmailFromAddress ?? 0),
    };
    if (!allow(counts)) return null;
    const [reserved] = await tx
      .insert(signInAttempts)
      .values({ email, address, attemptedAt: window.at })
      .returning({ id: signInAttempts.id });
    return reserved.id;
  });
}

/**
 * The right password: the reserved attempt and this address's earlier typos for the e-mail are
 * forgotten. Failures from other addresses stay, so one success does not give an attacker
 * elsewhere a fresh allowance.
 */
export async function releaseAttempt(email: string, address: string, reservedId: number) {
  await writeTransaction((tx) =>
    tx
      .delete(signInAttempts)
      .where(
        and(eq(signInAttempts.email, email), eq(signInAttempts.address, address), lte(signInAttempts.id, reservedId)),
      ),
  );
}
