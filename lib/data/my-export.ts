import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, results, squadAthletes, squads, testingSessions, tests, users } from "@/db/schema";
import { notFound } from "@/lib/errors";
import type { Actor } from "./actors";

/**
 * Everything the club holds about the signed-in athlete, for their data-rights export: the
 * profile and EVERY result recorded for them — draft sessions and sessions of squads they have
 * left included, each with its session's status — because the right of access covers all data
 * held about a person, not only what has been published to them. Consent does not gate it.
 * Staff notes on a result are included too (they are about the athlete); nothing of anyone else.
 */
export async function getMyExport(actor: Actor) {
  if (!actor.athleteId) throw notFound("Athlete");
  const db = getDb();
  const own = and(eq(athletes.id, actor.athleteId), eq(athletes.organizationId, actor.organizationId));
  const [[profile], squadRows, rows] = await Promise.all([
    db
      .select({
        name: athletes.name,
        email: users.email,
        dateOfBirth: athletes.dateOfBirth,
        sex: athletes.sex,
        position: athletes.position,
        externalId: athletes.externalId,
        otherNamesInFiles: athletes.aliases,
        consentRecordedOn: athletes.consentRecordedOn,
        guardianConsentOn: athletes.guardianConsentOn,
        archived: athletes.archived,
      })
      .from(athletes)
      .leftJoin(users, eq(users.id, athletes.userId))
      .where(own),
    db
      .select({ name: squads.name })
      .from(squadAthletes)
      .innerJoin(squads, eq(squads.id, squadAthletes.squadId))
      .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
      .where(and(own, eq(squads.organizationId, actor.organizationId)))
      .orderBy(asc(squads.name)),
    db
      .select({
        date: testingSessions.date,
        phase: testingSessions.phase,
        sessionStatus: testingSessions.status,
        squad: squads.name,
        test: tests.name,
        unit: tests.unit,
        direction: tests.direction,
        trials: results.trials,
        value: results.value,
        flag: results.flag,
        note: results.note,
        updatedAt: results.updatedAt,
      })
      .from(results)
      .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
      .innerJoin(squads, eq(squads.id, testingSessions.squadId))
      .innerJoin(tests, eq(tests.id, results.testId))
      .where(and(eq(results.athleteId, actor.athleteId), eq(results.organizationId, actor.organizationId)))
      .orderBy(asc(testingSessions.date), asc(testingSessions.id), asc(tests.name)),
  ]);
  if (!profile) throw notFound("Athlete");
  return {
    exportedAt: new Date().toISOString(),
    organization: actor.organizationName,
    profile: { ...profile, squads: squadRows.map((s) => s.name) },
    results: rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() })),
  };
}

export type MyExport = Awaited<ReturnType<typeof getMyExport>>;
