/**
 * WHERE-clause builders that keep every query inside the caller's reach:
 * the organisation always, a coach's own squads, an athlete's own record.
 */
import "server-only";
import { and, eq, inArray, or, type SQL, sql } from "drizzle-orm";
import type { SelectResultFields } from "drizzle-orm/query-builders/select.types";
import type { SelectedFields } from "drizzle-orm/sqlite-core";
import { getDb, type Reader } from "@/db/client";
import { athletes, results, squadAthletes, squadCoaches, squads, testingSessions, tests } from "@/db/schema";
import { isCoach, isManager } from "@/lib/auth/permissions";
import { notFound } from "@/lib/errors";
import type { Actor } from "./actors";

/** Squads a coach is assigned to, inside the organisation. */
function coachSquadIds(actor: Actor) {
  return getDb()
    .select({ id: squadCoaches.squadId })
    .from(squadCoaches)
    .innerJoin(squads, eq(squads.id, squadCoaches.squadId))
    .where(and(eq(squadCoaches.userId, actor.userId), eq(squads.organizationId, actor.organizationId)));
}

/** Athletes reachable through a coach's squads. */
function coachAthleteIds(actor: Actor) {
  return getDb()
    .select({ id: squadAthletes.athleteId })
    .from(squadAthletes)
    .where(inArray(squadAthletes.squadId, coachSquadIds(actor)));
}

const never = sql`0 = 1`;

export function squadScope(actor: Actor): SQL {
  const inOrg = eq(squads.organizationId, actor.organizationId);
  if (isManager(actor)) return inOrg;
  if (isCoach(actor)) return and(inOrg, inArray(squads.id, coachSquadIds(actor)))!;
  return never;
}

export function athleteScope(actor: Actor): SQL {
  const inOrg = eq(athletes.organizationId, actor.organizationId);
  if (isManager(actor)) return inOrg;
  if (isCoach(actor)) return and(inOrg, inArray(athletes.id, coachAthleteIds(actor)))!;
  if (actor.athleteId) return and(inOrg, eq(athletes.id, actor.athleteId))!;
  return never;
}

/** Athletes see only published sessions of squads they belong to. */
export function sessionScope(actor: Actor): SQL {
  const inOrg = eq(testingSessions.organizationId, actor.organizationId);
  if (isManager(actor)) return inOrg;
  if (isCoach(actor)) return and(inOrg, inArray(testingSessions.squadId, coachSquadIds(actor)))!;
  if (!actor.athleteId) return never;
  const ownSquads = getDb()
    .select({ id: squadAthletes.squadId })
    .from(squadAthletes)
    .where(eq(squadAthletes.athleteId, actor.athleteId));
  return and(inOrg, eq(testingSessions.status, "published"), inArray(testingSessions.squadId, ownSquads))!;
}

/**
 * The athletes a session's sheet covers: its squad's current members, plus anyone who already
 * has a result in that session (history stays on the session it was recorded in). The sheet,
 * its saves and the import all use this one rule; the caller has the session in reach.
 */
export function onSessionSheet(session: { id: number; squadId: number }, { activeMembersOnly = false } = {}): SQL {
  const members = getDb()
    .select({ id: squadAthletes.athleteId })
    .from(squadAthletes)
    .where(eq(squadAthletes.squadId, session.squadId));
  const withResult = getDb().select({ id: results.athleteId }).from(results).where(eq(results.sessionId, session.id));
  const inSquad = activeMembersOnly
    ? and(inArray(athletes.id, members), eq(athletes.archived, false))!
    : inArray(athletes.id, members);
  return or(inSquad, inArray(athletes.id, withResult))!;
}

/**
 * The session, with the chosen columns (its squad's may be among them), if the caller reaches
 * it; otherwise "not found", whether it exists elsewhere or not at all.
 */
export async function findSessionInScope<C extends SelectedFields>(
  reader: Reader,
  actor: Actor,
  sessionId: number,
  columns: C,
): Promise<SelectResultFields<C>> {
  // Widened for the builder, whose join types cannot follow a generic selection; an inner
  // join leaves every column as its table declares it, which is what the signature promises.
  const [row] = await reader
    .select(columns as SelectedFields)
    .from(testingSessions)
    .innerJoin(squads, eq(squads.id, testingSessions.squadId))
    .where(and(eq(testingSessions.id, sessionId), sessionScope(actor)));
  if (!row) throw notFound("Session");
  return row as SelectResultFields<C>;
}

export async function squadInReach(actor: Actor, squadId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: squads.id })
    .from(squads)
    .where(and(eq(squads.id, squadId), squadScope(actor)))
    .limit(1);
  return rows.length > 0;
}

export async function athleteInReach(actor: Actor, athleteId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: athletes.id })
    .from(athletes)
    .where(and(eq(athletes.id, athleteId), athleteScope(actor)))
    .limit(1);
  return rows.length > 0;
}

export async function sessionInReach(actor: Actor, sessionId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: testingSessions.id })
    .from(testingSessions)
    .where(and(eq(testingSessions.id, sessionId), sessionScope(actor)))
    .limit(1);
  return rows.length > 0;
}

/** Every member of the organisation may read its test library. */
export async function testInReach(actor: Actor, testId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: tests.id })
    .from(tests)
    .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)))
    .limit(1);
  return rows.length > 0;
}
