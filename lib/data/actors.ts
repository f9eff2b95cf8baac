import "server-only";
import { asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, memberships, organizations, users } from "@/db/schema";
import { isAthlete } from "@/lib/auth/permissions";
import { type Role } from "@/lib/domain";

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
