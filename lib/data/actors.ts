import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { getDb, type Transaction, writeTransaction } from "@/db/client";
import { athletes, memberships, organizations, users } from "@/db/schema";
import { isAthlete } from "@/lib/auth/permissions";
import type { Role } from "@/lib/domain";

export type Actor = {
  userId: number;
  email: string;
  name: string;
  organizationId: number;
  organizationName: string;
  role: Role;
  /** The athlete record this user is linked to in the organisation (athletes only). */
  athleteId: number | null;
};

/**
 * Resolves who is asking: user, organisation and role, read fresh each request so a
 * role change or removal takes effect at once. A user in several organisations acts
 * in the one they joined first.
 */
export async function loadActor(userId: number): Promise<Actor | null> {
  const db = getDb();
  const [row] = await db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      organizationId: organizations.id,
      organizationName: organizations.name,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(organizations, eq(organizations.id, memberships.organizationId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt), asc(memberships.id))
    .limit(1);
  if (!row) return null;
  let athleteId: number | null = null;
  if (isAthlete(row)) {
    const [linked] = await db
      .select({ id: athletes.id, organizationId: athletes.organizationId })
      .from(athletes)
      .where(eq(athletes.userId, userId))
      .limit(1);
    athleteId = linked && linked.organizationId === row.organizationId ? linked.id : null;
  }
  return { ...row, athleteId };
}

/** What a session token claims: whose it is and which of their session versions it carries. */
export type SessionClaims = { userId: number; sessionVersion: number };

/**
 * False once the user's sessions were ended after this token was issued (or the user is gone).
 * Checked on every request, because a signed token stays valid in any copy of the cookie.
 */
export async function sessionIsCurrent({ userId, sessionVersion }: SessionClaims): Promise<boolean> {
  const [row] = await getDb()
    .select({ sessionVersion: users.sessionVersion })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  return row !== undefined && row.sessionVersion === sessionVersion;
}

/**
 * Ends every session of this user, on every device. Call it when a password is changed or
 * reset and when a member is removed: the next request with any older token is signed out.
 * Inside a write transaction pass its `tx`, so the sessions end exactly when the change commits.
 */
export async function endAllSessions(userId: number, tx?: Transaction): Promise<void> {
  const end = (t: Transaction) =>
    t
      .update(users)
      .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, userId));
  if (tx) await end(tx);
  else await writeTransaction(end);
}

/**
 * Sign-out: ends the user's sessions only if the token is still current, so someone holding an
 * old, already ended cookie cannot use sign-out to end the sessions the user has started since.
 */
export async function endSession({ userId, sessionVersion }: SessionClaims): Promise<boolean> {
  const changed = await writeTransaction((tx) =>
    tx
      .update(users)
      .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(and(eq(users.id, userId), eq(users.sessionVersion, sessionVersion)))
      .returning({ id: users.id }),
  );
  return changed.length > 0;
}
