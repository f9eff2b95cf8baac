import "server-only";
import { and, eq, inArray, isNotNull, isNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { results, squads, testingSessions } from "@/db/schema";
import type { Phase, SwcMethod } from "@/lib/domain";
import { reportSwc } from "@/lib/reports/change-report";
import { StatsInputError } from "@/lib/stats";
import type { Actor } from "./actors";
import { sessionScope } from "./scope";

/** Sessions whose scores describe a squad before training: the ones an SWC is read from. */
const BASELINE_PHASES: Phase[] = ["baseline", "pre-block"];

type SwcTest = { id: number; swcMethod: SwcMethod; swcValue: number; cvPercent: number | null };

export type CurrentSwc = {
  /** In the test's unit; null when it cannot be computed (no baseline session yet, or no CV%). */
  value: number | null;
  /** The session whose scores gave it (null for a fixed SWC, which needs none). */
  from: { sessionId: number; date: string; phase: Phase; squadName: string; n: number } | null;
};

/**
 * Each test's SWC in its own unit as it stands today: from the latest baseline or pre-block session
 * in the caller's reach with at least two usable scores of the test (unflagged, with a value),
 * by the test's own method. A fixed SWC is its value. Derived from many athletes' scores, so it is
 * for staff only (the caller checks `canSeeResultCounts`).
 */
export async function currentSwcByTest(actor: Actor, list: SwcTest[]): Promise<Map<number, CurrentSwc>> {
  const wanted = list.filter((t) => t.swcMethod !== "fixed").map((t) => t.id);
  const rows = wanted.length
    ? await getDb()
        .select({
          testId: results.testId,
          value: results.value,
          sessionId: testingSessions.id,
          date: testingSessions.date,
          phase: testingSessions.phase,
          squadName: squads.name,
        })
        .from(results)
        .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
        .innerJoin(squads, eq(squads.id, testingSessions.squadId))
        .where(
          and(
            eq(results.organizationId, actor.organizationId),
            inArray(results.testId, wanted),
            inArray(testingSessions.phase, BASELINE_PHASES),
            isNull(results.flag),
            isNotNull(results.value),
            sessionScope(actor),
          ),
        )
    : [];
  // Per test, per session: the scores; then the latest session (date, then id) with two or more.
  const grouped = new Map<number, Map<number, { row: (typeof rows)[number]; values: number[] }>>();
  for (const row of rows) {
    const sessions = grouped.get(row.testId) ?? new Map();
    grouped.set(row.testId, sessions);
    const entry = sessions.get(row.sessionId) ?? { row, values: [] };
    entry.values.push(row.value!);
    sessions.set(row.sessionId, entry);
  }
  const answer = new Map<number, CurrentSwc>();
  for (const test of list) {
    if (test.swcMethod === "fixed") {
      answer.set(test.id, { value: test.swcValue, from: null });
      continue;
    }
    const latest = [...(grouped.get(test.id)?.values() ?? [])]
      .filter((s) => s.values.length >= 2)
      .sort((a, b) => b.row.date.localeCompare(a.row.date) || b.row.sessionId - a.row.sessionId)[0];
    if (!latest) {
      answer.set(test.id, { value: null, from: null });
      continue;
    }
    const { sessionId, date, phase, squadName } = latest.row;
    const from = { sessionId, date, phase, squadName, n: latest.values.length };
    answer.set(test.id, { value: swcOrNull(test, latest.values), from });
  }
  return answer;
}

function swcOrNull(test: SwcTest, values: number[]): number | null {
  try {
    return reportSwc({ method: test.swcMethod, value: test.swcValue }, values, test.cvPercent);
  } catch (error) {
    // A CV-based SWC without a CV, or a mean of zero: nothing to show but the method.
    if (error instanceof StatsInputError) return null;
    throw error;
  }
}
