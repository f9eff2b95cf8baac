import "server-only";
import { and, asc, count, desc, eq, inArray, max } from "drizzle-orm";
import { getDb } from "@/db/client";
import { squadAthletes, squads, testingSessions, athletes } from "@/db/schema";
import type { Actor } from "./actors";
import { squadScope } from "./scope";

export type SquadSummary = {
  id: number;
  name: string;
  sport: string | null;
  archived: boolean;
  athleteCount: number;
  latestSession: { id: number; date: string; phase: string; status: string } | null;
};

/** The caller's squads with how many active athletes they hold and their latest session. */
export async function listSquads(actor: Actor, { includeArchived = false } = {}): Promise<SquadSummary[]> {
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
  const latestBySquad = new Map<number, SquadSummary["latestSession"]>();
  for (const s of latest) {
    if (!latestBySquad.has(s.squadId)) latestBySquad.set(s.squadId, { id: s.id, date: s.date, phase: s.phase, status: s.status });
  }
  return rows.map((r) => ({
    ...r,
    athleteCount: countBySquad.get(r.id) ?? 0,
    latestSession: latestBySquad.get(r.id) ?? null,
  }));
}

