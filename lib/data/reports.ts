import "server-only";
import { and, asc, desc, eq, inArray, or } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import {
  athletes,
  results,
  savedReports,
  sessionTests,
  squadAthletes,
  squads,
  testingSessions,
  tests,
  users,
} from "@/db/schema";
import { invalidInput, notFound } from "@/lib/errors";
import { buildChangeReport, type ReportRow } from "@/lib/reports/change-report";
import { StatsInputError } from "@/lib/stats";
import type { ChangeReportQuery, SavedReportCreateInput } from "@/lib/validation/reports";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { findSessionInScope, squadScope } from "./scope";

export const sessionFields = {
  id: testingSessions.id,
  squadId: testingSessions.squadId,
  squadName: squads.name,
  date: testingSessions.date,
  phase: testingSessions.phase,
  status: testingSessions.status,
};

export async function loadTest(actor: Actor, testId: number) {
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
export async function assertInBattery(sessionIds: number[], testId: number) {
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
export async function loadRows(
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

/**
 * Saves a report with its note. The numbers are recomputed here from the stored scores, never
 * taken from the client, and kept as a snapshot so the saved report reopens exactly as written.
 */
export async function saveReport(actor: Actor, input: SavedReportCreateInput) {
  const { note, ...settings } = input;
  const report = await getChangeReport(actor, { ...settings, swcValue: settings.swcValue });
  return writeTransaction(async (tx) => {
    const [saved] = await tx
      .insert(savedReports)
      .values({
        organizationId: actor.organizationId,
        squadId: report.sessions.from.squadId,
        testId: report.test.id,
        fromSessionId: report.sessions.from.id,
        toSessionId: report.sessions.to.id,
        settings,
        snapshot: report,
        note,
        createdBy: actor.userId,
      })
      .returning({ id: savedReports.id, createdAt: savedReports.createdAt });
    await recordAudit(tx, actor, {
      action: "report.save",
      entity: { type: "report", id: saved.id },
      after: { settings, note },
    });
    return { id: saved.id, createdAt: saved.createdAt.getTime() };
  });
}

const savedColumns = {
  id: savedReports.id,
  squadId: savedReports.squadId,
  fromSessionId: savedReports.fromSessionId,
  toSessionId: savedReports.toSessionId,
  settings: savedReports.settings,
  note: savedReports.note,
  createdAt: savedReports.createdAt,
  authorName: users.name,
  testName: tests.name,
};

/** Saved reports of the squads in reach (one squad when asked), newest first. */
export async function listSavedReports(actor: Actor, { squadId }: { squadId?: number } = {}) {
  const rows = await getDb()
    .select(savedColumns)
    .from(savedReports)
    .innerJoin(squads, eq(squads.id, savedReports.squadId))
    .innerJoin(tests, eq(tests.id, savedReports.testId))
    .leftJoin(users, eq(users.id, savedReports.createdBy))
    .where(
      and(
        eq(savedReports.organizationId, actor.organizationId),
        squadScope(actor),
        squadId ? eq(savedReports.squadId, squadId) : undefined,
      ),
    )
    .orderBy(desc(savedReports.createdAt), desc(savedReports.id))
    .limit(100);
  return rows.map((r) => ({ ...r, settings: r.settings as ChangeReportQuery, createdAt: r.createdAt.getTime() }));
}

type Snapshot = Awaited<ReturnType<typeof getChangeReport>>;

/** The figures that make a report: if any differ when recomputed, the data changed since it was saved. */
const figures = (r: Snapshot) => JSON.stringify([r.squad, r.athletes, r.excluded, r.settings]);

/** One saved report as it was saved, and whether today's scores would give different figures. */
export async function getSavedReport(actor: Actor, id: number) {
  const [row] = await getDb()
    .select({ ...savedColumns, snapshot: savedReports.snapshot })
    .from(savedReports)
    .innerJoin(squads, eq(squads.id, savedReports.squadId))
    .innerJoin(tests, eq(tests.id, savedReports.testId))
    .leftJoin(users, eq(users.id, savedReports.createdBy))
    .where(and(eq(savedReports.id, id), eq(savedReports.organizationId, actor.organizationId), squadScope(actor)));
  if (!row) throw notFound("Saved report");
  const snapshot = row.snapshot as unknown as Snapshot;
  let changedSince: boolean;
  try {
    changedSince = figures(await getChangeReport(actor, row.settings as ChangeReportQuery)) !== figures(snapshot);
  } catch {
    // The scores no longer give a report at all (e.g. fewer than two pairs remain).
    changedSince = true;
  }
  return {
    ...row,
    settings: row.settings as ChangeReportQuery,
    snapshot,
    createdAt: row.createdAt.getTime(),
    changedSince,
  };
}
