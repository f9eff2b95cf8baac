/**
 * What the typo guard (lib/suspect.ts) needs to know about a session: each test's plausible
 * range and typical error, each athlete's latest earlier published score, and the squad's
 * between-athlete SD of those scores. The Session sheet carries it to the browser; the results
 * API and the import use it to report suspect scores.
 */
import "server-only";
import { and, eq, inArray, isNotNull, isNull, lt, or } from "drizzle-orm";
import { sampleStandardDeviation } from "simple-statistics";
import { getDb, type Reader } from "@/db/client";
import { athletes, results, testingSessions, tests } from "@/db/schema";
import { findSuspects, type Suspect, type TypoGuard } from "@/lib/suspect";
import { onSessionSheet } from "./scope";

/** Fewer earlier scores than this give no between-athlete SD worth using. */
const MIN_FOR_SD = 3;

/**
 * The typo guard's context for some athletes and tests of one session. "Earlier" means a
 * published session of the organisation dated on or before this one (not this one itself).
 */
export async function loadTypoGuard(
  reader: Reader,
  organizationId: number,
  session: { id: number; date: string },
  testIds: number[],
  athleteIds: number[],
): Promise<TypoGuard> {
  if (testIds.length === 0) return { tests: [], previous: [] };
  const [testRows, earlier] = await Promise.all([
    reader
      .select({
        testId: tests.id,
        plausibleMin: tests.plausibleMin,
        plausibleMax: tests.plausibleMax,
        typicalError: tests.typicalError,
      })
      .from(tests)
      .where(and(eq(tests.organizationId, organizationId), inArray(tests.id, testIds))),
    earlierScores(reader, organizationId, session, athleteIds, testIds),
  ]);
  const previous = new Map<string, { athleteId: number; testId: number; value: number }>();
  for (const row of earlier) {
    const key = `${row.athleteId}:${row.testId}`;
    if (!previous.has(key) && row.value !== null)
      previous.set(key, { athleteId: row.athleteId, testId: row.testId, value: row.value });
  }
  const latest = [...previous.values()];
  return {
    tests: testRows.map((t) => {
      const values = latest.filter((p) => p.testId === t.testId).map((p) => p.value);
      return { ...t, betweenAthleteSd: values.length >= MIN_FOR_SD ? sampleStandardDeviation(values) : null };
    }),
    previous: latest,
  };
}

/** SQLite caps the variables of one statement; big imports ask for their athletes in chunks. */
const CHUNK = 500;

/**
 * Every unflagged score of these athletes (and tests, when given) in published sessions before
 * this one — earlier in date, or the same day and created first — newest first. The typo guard
 * and the results mail's "since …" read an athlete's history through this one query.
 */
export async function earlierScores(
  reader: Reader,
  organizationId: number,
  session: { id: number; date: string },
  athleteIds: number[],
  testIds?: number[],
) {
  const chunks: number[][] = [];
  for (let i = 0; i < athleteIds.length; i += CHUNK) chunks.push(athleteIds.slice(i, i + CHUNK));
  const parts = await Promise.all(
    chunks.map((ids) =>
      reader
        .select({
          athleteId: results.athleteId,
          testId: results.testId,
          value: results.value,
          date: testingSessions.date,
          sessionId: testingSessions.id,
        })
        .from(results)
        .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
        .where(
          and(
            eq(results.organizationId, organizationId),
            inArray(results.athleteId, ids),
            testIds ? inArray(results.testId, testIds) : undefined,
            isNotNull(results.value),
            isNull(results.flag),
            eq(testingSessions.status, "published"),
            or(
              lt(testingSessions.date, session.date),
              and(eq(testingSessions.date, session.date), lt(testingSessions.id, session.id)),
            ),
          ),
        ),
    ),
  );
  return parts.flat().sort((a, b) => b.date.localeCompare(a.date) || b.sessionId - a.sessionId);
}

/**
 * The suspect trials among results just written to a session (flagged results are left out:
 * they count for nothing anyway). The caller has checked the session is in reach.
 */
export async function suspectsAmong(
  organizationId: number,
  sessionId: number,
  rows: readonly { athleteId: number; testId: number; trials: readonly (number | null)[]; flag: string | null }[],
): Promise<Suspect[]> {
  const unflagged = rows.filter((r) => r.flag === null);
  if (unflagged.length === 0) return [];
  const db = getDb();
  const [session] = await db
    .select({ id: testingSessions.id, date: testingSessions.date, squadId: testingSessions.squadId })
    .from(testingSessions)
    .where(and(eq(testingSessions.id, sessionId), eq(testingSessions.organizationId, organizationId)));
  if (!session) return [];
  // The whole sheet's athletes, not only those just written: the squad's spread needs them all.
  const onSheet = await db
    .select({ id: athletes.id })
    .from(athletes)
    .where(and(eq(athletes.organizationId, organizationId), onSessionSheet(session)));
  const guard = await loadTypoGuard(
    db,
    organizationId,
    session,
    [...new Set(unflagged.map((r) => r.testId))],
    [...new Set([...onSheet.map((a) => a.id), ...unflagged.map((r) => r.athleteId)])],
  );
  return findSuspects(guard, unflagged);
}
