/**
 * Members of the organisation and their roles (the People page, owner only). There is always at
 * least one owner: the last one can be neither demoted nor removed. Removal ends the person's
 * sessions at once.
 */
import "server-only";
import { and, asc, count, eq, inArray, isNotNull } from "drizzle-orm";
import { getDb, type Reader, type Transaction, writeTransaction } from "@/db/client";
import { athletes, memberships, squadCoaches, squads, users } from "@/db/schema";
import { isAthlete, isCoach, isOwner } from "@/lib/auth/permissions";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import type { MemberUpdateInput } from "@/lib/validation/people";
import { type Actor, endAllSessions } from "./actors";
import { recordAudit } from "./audit";

async function readMembers(reader: Reader, actor: Actor, userId?: number) {
  const org = actor.organizationId;
  const where = userId
    ? and(eq(memberships.organizationId, org), eq(memberships.userId, userId))
    : eq(memberships.organizationId, org);
  const [rows, coached, linked, [owners]] = await Promise.all([
    reader
      .select({
        userId: users.id,
        name: users.name,
        email: users.email,
        role: memberships.role,
        joinedAt: memberships.createdAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(where)
      .orderBy(asc(users.name), asc(users.id)),
    reader
      .select({ userId: squadCoaches.userId, id: squads.id, name: squads.name })
      .from(squadCoaches)
      .innerJoin(squads, eq(squads.id, squadCoaches.squadId))
      .where(eq(squads.organizationId, org))
      .orderBy(asc(squads.name)),
    reader
      .select({ userId: athletes.userId, id: athletes.id, name: athletes.name })
      .from(athletes)
      .where(and(eq(athletes.organizationId, org), isNotNull(athletes.userId))),
    reader
      .select({ n: count() })
      .from(memberships)
      .where(and(eq(memberships.organizationId, org), eq(memberships.role, "owner"))),
  ]);
  return rows.map((row) => ({
    ...row,
    joinedAt: row.joinedAt.getTime(),
    isYou: row.userId === actor.userId,
    /** Squads a coach is assigned to (assignments are made on each squad's Roster). */
    squads: isCoach(row) ? coached.filter((c) => c.userId === row.userId).map(({ id, name }) => ({ id, name })) : [],
    athlete: linked.find((a) => a.userId === row.userId && isAthlete(row)) ?? null,
    /** The only owner keeps the role: nobody could manage people otherwise. */
    lastOwner: isOwner(row) && owners.n <= 1,
  }));
}

export async function listMembers(actor: Actor) {
  return readMembers(getDb(), actor);
}

export type MemberItem = Awaited<ReturnType<typeof listMembers>>[number];

export async function getMember(actor: Actor, userId: number, reader: Reader = getDb()) {
  const [member] = await readMembers(reader, actor, userId);
  if (!member) throw notFound("Member");
  return member;
}

async function ownerCount(tx: Transaction, organizationId: number) {
  const [row] = await tx
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.organizationId, organizationId), eq(memberships.role, "owner")));
  return row.n;
}

/** Unassigns a coach from the organisation's squads (the role or the membership is going). */
async function dropSquadAssignments(tx: Transaction, actor: Actor, userId: number) {
  const own = tx.select({ id: squads.id }).from(squads).where(eq(squads.organizationId, actor.organizationId));
  await tx.delete(squadCoaches).where(and(eq(squadCoaches.userId, userId), inArray(squadCoaches.squadId, own)));
}

export async function updateMemberRole(actor: Actor, userId: number, { role }: MemberUpdateInput) {
  return writeTransaction(async (tx) => {
    const before = await getMember(actor, userId, tx);
    if (before.role === role) return before;
    // An athlete account belongs to its athlete record; staff accounts are never athletes.
    if (isAthlete(before) !== isAthlete({ role }))
      throw invalidInput(
        isAthlete(before)
          ? "An athlete's account stays an athlete's. To give this person a staff role, invite them with another address."
          : "A staff account cannot become an athlete. Invite the athlete from the People page instead.",
        { role: "Choose a staff role." },
      );
    if (isOwner(before) && (await ownerCount(tx, actor.organizationId)) <= 1)
      throw conflict(`${before.name} is the only owner. Make someone else an owner first.`);
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.userId, userId), eq(memberships.organizationId, actor.organizationId)));
    if (isCoach(before)) await dropSquadAssignments(tx, actor, userId);
    await recordAudit(tx, actor, {
      action: "member.update",
      entity: { type: "member", id: userId },
      before: { userId, role: before.role },
      after: { userId, role },
    });
    return getMember(actor, userId, tx);
  });
}

/**
 * Removes a member from the organisation and ends their sessions. The account itself stays (it
 * may belong to other organisations); an athlete's record stays with the club, unlinked.
 */
export async function removeMember(actor: Actor, userId: number) {
  return writeTransaction(async (tx) => {
    const before = await getMember(actor, userId, tx);
    if (isOwner(before) && (await ownerCount(tx, actor.organizationId)) <= 1)
      throw conflict(`${before.name} is the only owner and cannot be removed. Make someone else an owner first.`);
    await tx
      .delete(memberships)
      .where(and(eq(memberships.userId, userId), eq(memberships.organizationId, actor.organizationId)));
    await dropSquadAssignments(tx, actor, userId);
    await tx
      .update(athletes)
      .set({ userId: null })
      .where(and(eq(athletes.userId, userId), eq(athletes.organizationId, actor.organizationId)));
    await endAllSessions(userId, tx);
    await recordAudit(tx, actor, {
      action: "member.remove",
      entity: { type: "member", id: userId },
      before: { userId, name: before.name, email: before.email, role: before.role },
    });
    return { userId };
  });
}
