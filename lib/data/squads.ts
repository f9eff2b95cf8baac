import "server-only";
import { and, asc, count, desc, eq, inArray, max } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { squadAthletes, squads, testingSessions, athletes, auditEvents, memberships, squadCoaches, users } from "@/db/schema";
import type { Actor } from "./actors";
import { squadScope, isManager } from "./scope";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import type { SquadCreateInput, SquadUpdateInput } from "@/lib/validation/roster";
import { isUniqueViolation } from "./errors";


/** The caller's squads with how many active athletes they hold and their latest session. */
export async function listSquads(actor: Actor, { includeArchived = false } = {}) {
  const db = getDb();
  const where = includeArchived ? squadScope(actor) : and(squadScope(actor), eq(squads.archived, false));
  const rows = await db
    .select({ id: squads.id, name: squads.name, sport: squads.sport, archived: squads.archived })
    .from(squads)
    .where(where)
    .orderBy(asc(squads.name));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);

  const counts = await db
    .select({ squadId: squadAthletes.squadId, n: count() })
    .from(squadAthletes)
    .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
    .where(and(inArray(squadAthletes.squadId, ids), eq(athletes.archived, false)))
    .groupBy(squadAthletes.squadId);

  const latestDates = db
    .select({ squadId: testingSessions.squadId, date: max(testingSessions.date).as("latest_date") })
    .from(testingSessions)
    .where(inArray(testingSessions.squadId, ids))
    .groupBy(testingSessions.squadId)
    .as("latest");
  const latest = await db
    .select({
      squadId: testingSessions.squadId,
      id: testingSessions.id,
      date: testingSessions.date,
      phase: testingSessions.phase,
      status: testingSessions.status,
    })
    .from(testingSessions)
    .innerJoin(
      latestDates,
      and(eq(latestDates.squadId, testingSessions.squadId), eq(latestDates.date, testingSessions.date)),
    )
    .orderBy(desc(testingSessions.id));

  const countBySquad = new Map(counts.map((c) => [c.squadId, c.n]));
  const latestBySquad = new Map<number, Omit<(typeof latest)[number], "squadId">>();
  for (const { squadId, ...session } of latest) if (!latestBySquad.has(squadId)) latestBySquad.set(squadId, session);
  return rows.map((r) => ({
    ...r,
    athleteCount: countBySquad.get(r.id) ?? 0,
    latestSession: latestBySquad.get(r.id) ?? null,
  }));
}

const squadColumns = { id: squads.id, name: squads.name, sport: squads.sport, archived: squads.archived };

export async function getSquad(actor: Actor, squadId: number) {
  const db = getDb();
  const [squad] = await db.select(squadColumns).from(squads).where(and(eq(squads.id, squadId), squadScope(actor)));
  if (!squad) throw notFound("Squad");
  const coaches = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(squadCoaches)
    .innerJoin(users, eq(users.id, squadCoaches.userId))
    .where(eq(squadCoaches.squadId, squadId))
    .orderBy(asc(users.name));
  return { squad: { ...squad, coaches }, canManage: actor.role === "owner", canEditRoster: isManager(actor) || actor.role === "coach" };
}

/** Members of the organisation with the coach role: the people a squad can be assigned to. */
export async function listCoaches(actor: Actor) {
  return getDb()
    .select({ id: users.id, name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.organizationId, actor.organizationId), eq(memberships.role, "coach")))
    .orderBy(asc(users.name));
}

const nameTaken = (name: string) => conflict(`There is already a squad called "${name}".`);

export async function createSquad(actor: Actor, input: SquadCreateInput) {
  try {
    return await writeTransaction(async (tx) => {
      const [row] = await tx.insert(squads).values({ ...input, organizationId: actor.organizationId }).returning(squadColumns);
      await tx.insert(auditEvents).values({
        organizationId: actor.organizationId, actorUserId: actor.userId, action: "squad.create", entityType: "squad", entityId: row.id, after: row,
      });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(input.name);
    throw error;
  }
}

export async function updateSquad(actor: Actor, squadId: number, input: SquadUpdateInput) {
  const { coachUserIds, ...changes } = input;
  try {
    return await writeTransaction(async (tx) => {
      const [before] = await tx
        .select(squadColumns)
        .from(squads)
        .where(and(eq(squads.id, squadId), eq(squads.organizationId, actor.organizationId)));
      if (!before) throw notFound("Squad");
      let row = before;
      if (Object.keys(changes).length > 0) {
        [row] = await tx.update(squads).set(changes).where(eq(squads.id, squadId)).returning(squadColumns);
      }
      if (coachUserIds) {
        const unique = [...new Set(coachUserIds)];
        const valid = unique.length
          ? await tx
              .select({ id: memberships.userId })
              .from(memberships)
              .where(and(eq(memberships.organizationId, actor.organizationId), eq(memberships.role, "coach"), inArray(memberships.userId, unique)))
          : [];
        if (valid.length !== unique.length) {
          throw invalidInput("Only coaches of your organisation can be assigned to a squad.", { coachUserIds: "Unknown coach." });
        }
        await tx.delete(squadCoaches).where(eq(squadCoaches.squadId, squadId));
        if (unique.length) await tx.insert(squadCoaches).values(unique.map((userId) => ({ squadId, userId })));
      }
      await tx.insert(auditEvents).values({
        organizationId: actor.organizationId, actorUserId: actor.userId, action: "squad.update", entityType: "squad", entityId: squadId, before, after: { ...row, coachUserIds },
      });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(input.name ?? "");
    throw error;
  }
}
