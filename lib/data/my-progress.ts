import "server-only";
import { and, eq, inArray, isNotNull, isNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, results, testingSessions } from "@/db/schema";
import { checkConsent, todayIso } from "@/lib/consent";
import { notFound } from "@/lib/errors";
import { historyOfTest, personalBest } from "@/lib/reports/athlete-history";
import { reportSwc } from "@/lib/reports/change-report";
import type { Actor } from "./actors";
import { HISTORY_CONFIDENCE, loadHistoryTests } from "./athlete-history";
import { sessionScope } from "./scope";

/**
 * Fewest usable scores in a session for its squad's spread to give an athlete an SWC. The SWC
 * is 0.2 × the SD of everyone's scores that day, and the athlete knows their own score: in a
 * squad of two that gives away the other athlete's score (own ± √2·SD), in a squad of three it
 * pins the other two to a circle. From ten scores on, one SD and one known score leave the other
 * nine free, so the number says nothing about any one team-mate. Below that, no SWC and no verdict.
 */
export const MIN_SQUAD_FOR_SWC = 10;

/** The signed-in athlete's own record, with what My progress and the export need to know. */
async function ownAthlete(actor: Actor) {
  if (!actor.athleteId) throw notFound("Athlete");
  const [athlete] = await getDb()
    .select({
      id: athletes.id,
      name: athletes.name,
      dateOfBirth: athletes.dateOfBirth,
      consentRecordedOn: athletes.consentRecordedOn,
      guardianConsentOn: athletes.guardianConsentOn,
    })
    .from(athletes)
    .where(and(eq(athletes.id, actor.athleteId), eq(athletes.organizationId, actor.organizationId)));
  if (!athlete) throw notFound("Athlete");
  return athlete;
}

/**
 * Whether the signed-in athlete may see their results today (their consent, and a guardian's
 * while they are under 18). Staff are not asked.
 */
export async function athleteConsent(actor: Actor) {
  return checkConsent(await ownAthlete(actor), todayIso());
}

/**
 * The SD-based SWC of each (session, test) the athlete has a score in, from every usable score
 * of that test in that session — only where at least MIN_SQUAD_FOR_SWC athletes were scored.
 * Only the SWC leaves this function, never a score.
 */
async function squadSwcs(actor: Actor, tests: { id: number; swcValue: number; sessionIds: number[] }[]) {
  const sessionIds = [...new Set(tests.flatMap((t) => t.sessionIds))];
  const testIds = tests.map((t) => t.id);
  const answer = new Map<string, number>();
  if (sessionIds.length === 0 || testIds.length === 0) return answer;
  const rows = await getDb()
    .select({ sessionId: results.sessionId, testId: results.testId, value: results.value })
    .from(results)
    .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
    .where(
      and(
        eq(results.organizationId, actor.organizationId),
        inArray(results.sessionId, sessionIds),
        inArray(results.testId, testIds),
        isNull(results.flag),
        isNotNull(results.value),
        sessionScope(actor),
      ),
    );
  const grouped = new Map<string, number[]>();
  for (const r of rows) {
    const key = `${r.sessionId}:${r.testId}`;
    grouped.set(key, [...(grouped.get(key) ?? []), r.value!]);
  }
  for (const test of tests) {
    for (const sessionId of test.sessionIds) {
      const values = grouped.get(`${sessionId}:${test.id}`) ?? [];
      if (values.length < MIN_SQUAD_FOR_SWC) continue;
      answer.set(`${sessionId}:${test.id}`, reportSwc({ method: "sd-factor", value: test.swcValue }, values, null));
    }
  }
  return answer;
}

/**
 * My progress: the signed-in athlete's own scores in published sessions, each test with its
 * changes, intervals and verdicts (the Athlete history's computation), personal bests, and
 * nothing of any other athlete. Without the needed consent, no results at all.
 */
export async function getMyProgress(actor: Actor) {
  const athlete = await ownAthlete(actor);
  const consent = checkConsent(athlete, todayIso());
  const base = {
    athlete: { name: athlete.name },
    consent,
    confidence: HISTORY_CONFIDENCE,
    minSquad: MIN_SQUAD_FOR_SWC,
  };
  if (!consent.ok) return { ...base, tests: [] };
  // The session scope keeps an athlete to published sessions of their own squads.
  const tests = await loadHistoryTests(actor, athlete.id);
  const swcs = await squadSwcs(
    actor,
    tests
      .filter((t) => t.swcMethod === "sd-factor" && t.typicalError !== null)
      .map((t) => ({ id: t.id, swcValue: t.swcValue, sessionIds: t.scores.map((s) => s.sessionId) })),
  );
  return {
    ...base,
    tests: tests.map((test) => {
      const history = historyOfTest(test, HISTORY_CONFIDENCE, {
        squadSwc: (sessionId) => swcs.get(`${sessionId}:${test.id}`) ?? null,
      });
      const best = personalBest(history.scores, test.direction);
      const latest = [...history.scores].reverse().find((s) => s.change !== null) ?? null;
      const previous = latest ? (history.scores.find((s) => s.sessionId === latest.previousSessionId) ?? null) : null;
      return {
        ...history,
        best: best && { sessionId: best.sessionId, date: best.date, value: best.value! },
        latest: latest && previous ? { ...latest, previousDate: previous.date, previousValue: previous.value! } : null,
      };
    }),
  };
}
