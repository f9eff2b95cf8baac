import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { results, testingSessions, tests } from "@/db/schema";
import { isAthlete } from "@/lib/auth/permissions";
import type { Actor } from "./actors";
import { athleteConsent } from "./my-progress";
import { sessionScope } from "./scope";

/**
 * One athlete's results over time. The caller must already have the athlete in reach;
 * the session scope still applies, so an athlete sees only published sessions, and only once
 * their club has recorded the consent they need (My progress says why when it has not).
 */
export async function listAthleteResults(actor: Actor, athleteId: number) {
  if (isAthlete(actor) && !(await athleteConsent(actor)).ok) return [];
  return getDb()
    .select({
      id: results.id,
      sessionId: results.sessionId,
      date: testingSessions.date,
      phase: testingSessions.phase,
      status: testingSessions.status,
      testId: results.testId,
      testName: tests.name,
      unit: tests.unit,
      decimals: tests.decimals,
      direction: tests.direction,
      trials: results.trials,
      value: results.value,
      flag: results.flag,
    })
    .from(results)
    .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
    .innerJoin(tests, eq(tests.id, results.testId))
    .where(and(eq(results.athleteId, athleteId), eq(results.organizationId, actor.organizationId), sessionScope(actor)))
    .orderBy(asc(testingSessions.date), asc(tests.name));
}
