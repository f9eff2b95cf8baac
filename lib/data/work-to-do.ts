import "server-only";
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, results, sessionTests, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { defaultComparison } from "@/lib/reports/defaults";
import type { Actor } from "./actors";
import { sessionScope, squadScope } from "./scope";

/** How many names of athletes still missing a score the home lists before "and n more". */
export const MISSING_NAMES_SHOWN = 3;

type Score = { sessionId: number; athleteId: number; testId: number; value: number | null; flag: string | null };

/**
 * What needs doing in the caller's squads (the staff home): draft sessions with scores still
 * missing, squads whose latest pre-block/post-block pair has scores to compare, and tests used in
 * their sessions that still have no typical error. Everything is scoped like the screens it links to.
 */
export async function getWorkToDo(actor: Actor) {
  const db = getDb();
  const sessions = await db
    .select({
      id: testingSessions.id,
      squadId: testingSessions.squadId,
      squadName: squads.name,
      date: testingSessions.date,
      phase: testingSessions.phase,
      status: testingSessions.status,
    })
    .from(testingSessions)
    .innerJoin(squads, eq(squads.id, testingSessions.squadId))
    .where(and(sessionScope(actor), squadScope(actor), eq(squads.archived, false)))
    .orderBy(asc(testingSessions.date), asc(testingSessions.id));
  const drafts = sessions.filter((s) => s.status === "draft");
  const pairable = sessions.filter((s) => s.phase === "pre-block" || s.phase === "post-block");
  const ids = [...new Set([...drafts, ...pairable].map((s) => s.id))];
  const allIds = sessions.map((s) => s.id);
  const draftSquads = [...new Set(drafts.map((s) => s.squadId))];
  const [battery, scores, members, untested] = await Promise.all([
    allIds.length
      ? db
          .select({ sessionId: sessionTests.sessionId, testId: sessionTests.testId })
          .from(sessionTests)
          .where(inArray(sessionTests.sessionId, allIds))
      : [],
    ids.length
      ? db
          .select({
            sessionId: results.sessionId,
            athleteId: results.athleteId,
            testId: results.testId,
            value: results.value,
            flag: results.flag,
          })
          .from(results)
          .where(and(eq(results.organizationId, actor.organizationId), inArray(results.sessionId, ids)))
      : ([] as Score[]),
    draftSquads.length
      ? db
          .select({ squadId: squadAthletes.squadId, id: athletes.id, name: athletes.name })
          .from(squadAthletes)
          .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
          .where(and(inArray(squadAthletes.squadId, draftSquads), eq(athletes.archived, false)))
          .orderBy(asc(athletes.name))
      : [],
    allIds.length
      ? db
          .selectDistinct({ id: tests.id, name: tests.name })
          .from(tests)
          .innerJoin(sessionTests, eq(sessionTests.testId, tests.id))
          .where(
            and(
              eq(tests.organizationId, actor.organizationId),
              eq(tests.archived, false),
              isNull(tests.typicalError),
              inArray(sessionTests.sessionId, allIds),
            ),
          )
          .orderBy(asc(tests.name))
      : [],
  ]);
  const testsOf = (sessionId: number) => battery.filter((b) => b.sessionId === sessionId).map((b) => b.testId);

  // A cell counts as done once it holds a score or a flag (absent, injured, invalid).
  const done = new Set(
    scores.filter((s) => s.value !== null || s.flag !== null).map((s) => `${s.sessionId}:${s.athleteId}:${s.testId}`),
  );
  const missingScores = drafts
    .map((session) => {
      const battery = testsOf(session.id);
      const squadMembers = members.filter((m) => m.squadId === session.squadId);
      const missingBy = squadMembers
        .map((m) => ({ name: m.name, n: battery.filter((t) => !done.has(`${session.id}:${m.id}:${t}`)).length }))
        .filter((m) => m.n > 0);
      return {
        sessionId: session.id,
        squadName: session.squadName,
        date: session.date,
        phase: session.phase,
        missing: missingBy.reduce((sum, m) => sum + m.n, 0),
        athletes: missingBy.length,
        names: missingBy.slice(0, MISSING_NAMES_SHOWN).map((m) => m.name),
      };
    })
    .filter((s) => s.missing > 0)
    .reverse();

  // Tests a session has usable scores in (two or more, so a comparison can pair athletes).
  const usable = (sessionId: number, testId: number) =>
    new Set(
      scores
        .filter((s) => s.sessionId === sessionId && s.testId === testId && s.value !== null && s.flag === null)
        .map((s) => s.athleteId),
    );
  const choices = pairable.map((s) => ({
    ...s,
    testIds: testsOf(s.id).filter((t) => usable(s.id, t).size >= 2),
  }));
  const comparisons = [...new Set(pairable.map((s) => s.squadId))].flatMap((squadId) => {
    const pick = defaultComparison(choices, squadId);
    if (!pick) return [];
    const from = choices.find((s) => s.id === pick.fromSessionId)!;
    const to = choices.find((s) => s.id === pick.toSessionId)!;
    if (from.phase !== "pre-block" || to.phase !== "post-block") return [];
    const after = usable(to.id, pick.testId);
    const paired = [...usable(from.id, pick.testId)].filter((a) => after.has(a)).length;
    if (paired < 2) return [];
    return [{ ...pick, squadName: from.squadName, fromDate: from.date, toDate: to.date, paired }];
  });
  const testNames = new Map(
    (
      await (comparisons.length
        ? db
            .select({ id: tests.id, name: tests.name })
            .from(tests)
            .where(
              and(
                eq(tests.organizationId, actor.organizationId),
                inArray(
                  tests.id,
                  comparisons.map((c) => c.testId),
                ),
              ),
            )
        : Promise.resolve([]))
    ).map((t) => [t.id, t.name]),
  );
  return {
    missingScores,
    comparisons: comparisons.map((c) => ({ ...c, testName: testNames.get(c.testId) ?? "" })),
    testsWithoutTypicalError: untested,
  };
}
