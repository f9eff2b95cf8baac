import "server-only";
import { and, asc, count, desc, eq, inArray, max } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { athletes, memberships, squadAthletes, squadCoaches, squads, testingSessions, users } from "@/db/schema";
import { canEditRoster, canManageSquad } from "@/lib/auth/permissions";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import type { SquadCreateInput, SquadUpdateInput } from "@/lib/validation/roster";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { isUniqueViolation } from "./errors";
import { squadScope } from "./scope";

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

  const latestDates = db
    .select({ squadId: testingSessions.squadId, date: max(testingSessions.date).as("latest_date") })
    .from(testingSessions)
    .where(and(inArray(testingSessions.squadId, ids), eq(testingSessions.organizationId, actor.organizationId)))
    .groupBy(testingSessions.squadId)
    .as("latest");
  const [counts, latest] = await Promise.all([
    db
      .select({ squadId: squadAthletes.squadId, n: count() })
      .from(squadAthletes)
      .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
      .where(
        and(
          inArray(squadAthletes.squadId, ids),
          eq(athletes.organizationId, actor.organizationId),
          eq(athletes.archived, false),
        ),
      )
      .groupBy(squadAthletes.squadId),
    db
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
      .orderBy(desc(testingSessions.id)),
  ]);

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
  // The coaches are read beside the squad, not after it: the join through the squad keeps
  // that read inside the caller's reach on its own.
  const [[squad], coaches] = await Promise.all([
    db
      .select(squadColumns)
      .from(squads)
      .where(and(eq(squads.id, squadId), squadScope(actor))),
    db
      .select({ id: users.id, name: users.name, email: users.email })
      .from(squadCoaches)
      .innerJoin(squads, eq(squads.id, squadCoaches.squadId))
      .innerJoin(users, eq(users.id, squadCoaches.userId))
      .where(and(eq(squadCoaches.squadId, squadId), squadScope(actor)))
      .orderBy(asc(users.name)),
  ]);
  if (!squad) throw notFound("Squad");
  return { squad: { ...squad, coaches }, canManage: canManageSquad(actor), canEditRoster: canEditRoster(actor) };
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
      const [row] = await tx
        .insert(squads)
        .values({ ...input, organizationId: actor.organizationId })
        .returning(squadColumns);
      await recordAudit(tx, actor, { action: "squad.create", entity: { type: "squad", id: row.id }, after: row });
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
              .where(
                and(
                  eq(memberships.organizationId, actor.organizationId),
                  eq(memberships.role, "coach"),
                  inArray(memberships.userId, unique),
                ),
              )
          : [];
        if (valid.length !== unique.length) {
          throw invalidInput("Only coaches of your organisation can be assigned to a squad.", {
            coachUserIds: "Unknown coach.",
          });
        }
        await tx.delete(squadCoaches).where(eq(squadCoaches.squadId, squadId));
        if (unique.length) await tx.insert(squadCoaches).values(unique.map((userId) => ({ squadId, userId })));
      }
      await recordAudit(tx, actor, {
        action: "squad.update",
        entity: { type: "squad", id: squadId },
        before,
        after: { ...row, coachUserIds },
      });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(input.name ?? "");
    throw error;
  }
}
