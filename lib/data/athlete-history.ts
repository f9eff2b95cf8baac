import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, results, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { notFound } from "@/lib/errors";
import { type HistoryTest, historyOfTest } from "@/lib/reports/athlete-history";
import type { Actor } from "./actors";
import { athleteScope, sessionScope, squadScope } from "./scope";

/**
 * Athlete history: one athlete (staff only; the caller has the athlete in reach) and every test
 * they have a score in, over time, with the change from one score to the next against the test's
 * noise. Sessions follow the session scope, so a coach sees the scores of their own squads'
 * sessions, drafts included.
 */
export async function getAthleteHistory(actor: Actor, athleteId: number) {
  const db = getDb();
  const [[athlete], squadRows, tests] = await Promise.all([
    db
      .select({ id: athletes.id, name: athletes.name, position: athletes.position, archived: athletes.archived })
      .from(athletes)
      .where(and(eq(athletes.id, athleteId), athleteScope(actor))),
    db
      .select({ id: squads.id, name: squads.name })
      .from(squadAthletes)
      .innerJoin(squads, eq(squads.id, squadAthletes.squadId))
      .where(and(eq(squadAthletes.athleteId, athleteId), squadScope(actor)))
      .orderBy(asc(squads.name)),
    loadHistoryTests(actor, athleteId),
  ]);
  if (!athlete) throw notFound("Athlete");
  return {
    athlete: { ...athlete, squads: squadRows },
    confidence: HISTORY_CONFIDENCE,
    tests: tests.map((t) => historyOfTest(t, HISTORY_CONFIDENCE)),
  };
}

/**
 * One athlete's scores, grouped by test, oldest first, in the sessions the caller reaches (the
 * session scope: a coach's squads, drafts included; an athlete's own squads, published only).
 * Athlete history and My progress both read through here. The caller has the athlete in reach.
 */
export async function loadHistoryTests(actor: Actor, athleteId: number): Promise<HistoryTest[]> {
  const rows = await getDb()
    .select({
      resultId: results.id,
      sessionId: results.sessionId,
      date: testingSessions.date,
      phase: testingSessions.phase,
      status: testingSessions.status,
      squadName: squads.name,
      value: results.value,
      flag: results.flag,
      testId: tests.id,
      testName: tests.name,
      unit: tests.unit,
      decimals: tests.decimals,
      direction: tests.direction,
      swcMethod: tests.swcMethod,
      swcValue: tests.swcValue,
      cvPercent: tests.cvPercent,
      typicalError: tests.typicalError,
      typicalErrorDf: tests.typicalErrorDf,
    })
    .from(results)
    .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
    .innerJoin(squads, eq(squads.id, testingSessions.squadId))
    .innerJoin(tests, eq(tests.id, results.testId))
    .where(and(eq(results.athleteId, athleteId), eq(results.organizationId, actor.organizationId), sessionScope(actor)))
    .orderBy(asc(tests.name), asc(testingSessions.date), asc(testingSessions.id));

  const byTest = new Map<number, HistoryTest>();
  for (const r of rows) {
    let test = byTest.get(r.testId);
    if (!test) {
      test = {
        id: r.testId,
        name: r.testName,
        unit: r.unit,
        decimals: r.decimals,
        direction: r.direction,
        swcMethod: r.swcMethod,
        swcValue: r.swcValue,
        cvPercent: r.cvPercent,
        typicalError: r.typicalError,
        typicalErrorDf: r.typicalErrorDf,
        scores: [],
      };
      byTest.set(r.testId, test);
    }
    test.scores.push({
      resultId: r.resultId,
      sessionId: r.sessionId,
      date: r.date,
      phase: r.phase,
      status: r.status,
      squadName: r.squadName,
      value: r.value,
      flag: r.flag,
    });
  }
  return [...byTest.values()];
}

/** The Change report's default level, so an athlete's verdicts read the same on both screens. */
export const HISTORY_CONFIDENCE = 0.9;
