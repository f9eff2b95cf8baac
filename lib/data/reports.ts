import "server-only";
import { and, asc, eq, inArray, or } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, results, sessionTests, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { invalidInput, notFound } from "@/lib/errors";
import { buildChangeReport, type ReportRow } from "@/lib/reports/change-report";
import { StatsInputError } from "@/lib/stats";
import type { ChangeReportQuery } from "@/lib/validation/reports";
import type { Actor } from "./actors";
import { findSessionInScope } from "./scope";

const sessionFields = {
  id: testingSessions.id,
  squadId: testingSessions.squadId,
  squadName: squads.name,
  date: testingSessions.date,
  phase: testingSessions.phase,
  status: testingSessions.status,
};

async function loadTest(actor: Actor, testId: number) {
  const [test] = await getDb()
    .select({
      id: tests.id,
      name: tests.name,
      unit: tests.unit,
      decimals: tests.decimals,
      direction: tests.direction,
      swcMethod: tests.swcMethod,
      swcValue: tests.swcValue,
      cvPercent: tests.cvPercent,
      typicalError: tests.typicalError,
      typicalErrorDf: tests.typicalErrorDf,
      typicalErrorSource: tests.typicalErrorSource,
      version: tests.version,
    })
    .from(tests)
    .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)));
  if (!test) throw notFound("Test");
  return test;
}

/** Both sessions must measure the test; the report compares like with like. */
async function assertInBattery(sessionIds: number[], testId: number) {
  const rows = await getDb()
    .select({ sessionId: sessionTests.sessionId })
    .from(sessionTests)
    .where(and(inArray(sessionTests.sessionId, sessionIds), eq(sessionTests.testId, testId)));
  if (rows.length !== sessionIds.length)
    throw invalidInput("That test is not in the battery of both sessions.", { testId: "Not in both sessions." });
}

/**
 * Scores of the test in both sessions, for the squad's current athletes and anyone who has a
 * score in either session (history stays with the session it was recorded in).
 */
async function loadRows(
  actor: Actor,
  squadId: number,
  fromId: number,
  toId: number,
  testId: number,
): Promise<ReportRow[]> {
  const db = getDb();
  const scored = await db
    .select({ sessionId: results.sessionId, athleteId: results.athleteId, value: results.value, flag: results.flag })
    .from(results)
    .where(
      and(
        eq(results.organizationId, actor.organizationId),
        eq(results.testId, testId),
        inArray(results.sessionId, [fromId, toId]),
      ),
    );
  const members = db
    .select({ id: squadAthletes.athleteId })
    .from(squadAthletes)
    .where(eq(squadAthletes.squadId, squadId));
  const people = await db
    .select({ id: athletes.id, name: athletes.name })
    .from(athletes)
    .where(
      and(
        eq(athletes.organizationId, actor.organizationId),
        or(
          and(inArray(athletes.id, members), eq(athletes.archived, false)),
          inArray(athletes.id, [...new Set(scored.map((s) => s.athleteId))]),
        ),
      ),
    )
    .orderBy(asc(athletes.name));
  const score = (athleteId: number, sessionId: number) => {
    const hit = scored.find((s) => s.athleteId === athleteId && s.sessionId === sessionId);
    return hit ? { value: hit.value, flag: hit.flag } : null;
  };
  return people.map((p) => ({ athleteId: p.id, name: p.name, pre: score(p.id, fromId), post: score(p.id, toId) }));
}

/** The Change report for one test between two sessions of one squad (see lib/reports/change-report.ts). */
export async function getChangeReport(actor: Actor, query: ChangeReportQuery) {
  const db = getDb();
  const [from, to, test] = await Promise.all([
    findSessionInScope(db, actor, query.fromSessionId, sessionFields),
    findSessionInScope(db, actor, query.toSessionId, sessionFields),
    loadTest(actor, query.testId),
  ]);
  if (from.squadId !== to.squadId)
    throw invalidInput("The two sessions belong to different squads.", { toSessionId: "Another squad's session." });
  await assertInBattery([from.id, to.id], test.id);
  const rows = await loadRows(actor, from.squadId, from.id, to.id, test.id);
  const swc =
    query.swcMethod && query.swcValue !== undefined ? { method: query.swcMethod, value: query.swcValue } : undefined;
  try {
    const report = buildChangeReport({ test, rows, confidence: query.confidence, swc });
    // The test's own SWC method travels in `settings`, with the one this report used.
    const { swcMethod: _method, swcValue: _value, ...shown } = test;
    return {
      test: shown,
      sessions: { from, to },
      ...report,
    };
  } catch (error) {
    if (error instanceof StatsInputError) throw invalidInput(error.message);
    throw error;
  }
}
