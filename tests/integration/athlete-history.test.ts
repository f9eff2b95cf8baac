/**
 * Athlete history (GET /api/athletes/[id]/history), the Test library's current SWC values and
 * the staff home's "What needs doing" (GET /api/work-to-do) on the demo club. Expected numbers
 * are computed here from the stored scores with plain arithmetic and jStat's t quantile — not
 * with lib/stats.
 */
import { and, eq, inArray } from "drizzle-orm";
import jstatPkg from "jstat";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, results, sessionTests, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const jStat = (jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg;
const historyRoute = await import("@/app/api/athletes/[athleteId]/history/route");
const testsRoute = await import("@/app/api/tests/route");
const todoRoute = await import("@/app/api/work-to-do/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { tessa: 0, senior: 0, academy: 0, cmj: 0, sprint30: 0, sprint10: 0 };

beforeAll(async () => {
  env = await setupTestDatabase();
  const [tessa] = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Tessa Lindqvist"));
  ids.tessa = tessa.id;
  const sq = await env.db.select({ id: squads.id, name: squads.name }).from(squads);
  ids.senior = sq.find((s) => s.name === "Senior Women")!.id;
  ids.academy = sq.find((s) => s.name === "Academy U18")!.id;
  const t = await env.db.select({ id: tests.id, name: tests.name }).from(tests);
  ids.cmj = t.find((x) => x.name === "Countermovement jump")!.id;
  ids.sprint30 = t.find((x) => x.name === "30 m sprint")!.id;
  ids.sprint10 = t.find((x) => x.name === "10 m sprint")!.id;
});
afterAll(() => env.cleanup());

const history = (athleteId: number) => call(historyRoute.GET, { params: { athleteId: `${athleteId}` } });

/** The athlete's stored scores of one test, oldest first, straight from the tables. */
async function storedScores(athleteId: number, testId: number) {
  return env.db
    .select({ sessionId: results.sessionId, date: testingSessions.date, value: results.value, flag: results.flag })
    .from(results)
    .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
    .where(and(eq(results.athleteId, athleteId), eq(results.testId, testId)))
    .orderBy(testingSessions.date, testingSessions.id);
}

/** The verdict rules of PRODUCT.md §5, written out again on an interval oriented "better = positive". */
function verdictOf(lower: number, upper: number, swc: number) {
  if (lower >= -swc && upper <= swc) return "steady";
  if (lower > swc) return "clear-gain";
  if (upper < -swc) return "clear-decline";
  if (lower > 0) return "gain";
  if (upper < 0) return "decline";
  return "inconclusive";
}

const sd = (xs: number[]) => {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  return Math.sqrt(xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1));
};

type Point = {
  sessionId: number;
  value: number | null;
  flag: string | null;
  change: number | null;
  ciLower: number | null;
  ciUpper: number | null;
  swc: number | null;
  verdict: string | null;
};
type HistoryTestJson = { id: number; swcBasis: string; typicalError: number | null; scores: Point[] };

describe("GET /api/athletes/[athleteId]/history", () => {
  it("gives each change from the previous usable score, with the t-interval of √2·TE against a fixed SWC", async () => {
    // The 30 m sprint has a TE of 0.045 s on 24 df in the demo; give it a fixed SWC of 0.03 s.
    await env.db.update(tests).set({ swcMethod: "fixed", swcValue: 0.03 }).where(eq(tests.id, ids.sprint30));
    await signInAs("scientist@example.com");
    const { status, json } = await history(ids.tessa);
    expect(status).toBe(200);
    expect(json.athlete).toMatchObject({ id: ids.tessa, name: "Tessa Lindqvist" });
    expect(json.athlete.squads.map((s: { id: number }) => s.id)).toContain(ids.senior);

    const sprint = (json.tests as HistoryTestJson[]).find((t) => t.id === ids.sprint30)!;
    expect(sprint.swcBasis).toBe("fixed");
    const stored = await storedScores(ids.tessa, ids.sprint30);
    expect(sprint.scores.map((s) => s.sessionId)).toEqual(stored.map((s) => s.sessionId));
    const q = jStat.studentt.inv(0.95, 24);
    let previous: number | null = null;
    let checked = 0;
    for (const [i, row] of stored.entries()) {
      const got = sprint.scores[i];
      expect(got.value).toBe(row.value);
      expect(got.flag).toBe(row.flag);
      if (row.flag !== null || row.value === null) {
        expect(got.change).toBeNull();
        continue;
      }
      if (previous === null) {
        expect(got.change).toBeNull();
      } else {
        const change = row.value - previous;
        const half = q * Math.SQRT2 * 0.045;
        expect(got.change).toBeCloseTo(change, 12);
        expect(Math.abs(got.ciLower! - (change - half))).toBeLessThan(1e-6);
        expect(Math.abs(got.ciUpper! - (change + half))).toBeLessThan(1e-6);
        expect(got.swc).toBe(0.03);
        // Lower is better for a sprint: the interval is turned round before it is read.
        expect(got.verdict).toBe(verdictOf(-(change + half), -(change - half), 0.03));
        checked++;
      }
      previous = row.value;
    }
    expect(checked).toBeGreaterThan(0);
  });

  it("gives changes but no verdict where the SWC needs a squad's spread or there is no typical error", async () => {
    await signInAs("owner@example.com");
    const { json } = await history(ids.tessa);
    const cmj = (json.tests as HistoryTestJson[]).find((t) => t.id === ids.cmj)!;
    expect(cmj.swcBasis).toBe("no-te");
    await env.db.update(tests).set({ typicalError: 0.9, typicalErrorDf: 19 }).where(eq(tests.id, ids.cmj));
    const again = ((await history(ids.tessa)).json.tests as HistoryTestJson[]).find((t) => t.id === ids.cmj)!;
    expect(again.swcBasis).toBe("needs-squad");
    expect(again.scores.some((s) => s.change !== null)).toBe(true);
    expect(again.scores.every((s) => s.verdict === null && s.ciLower === null)).toBe(true);
    await env.db.update(tests).set({ typicalError: null, typicalErrorDf: null }).where(eq(tests.id, ids.cmj));
  });

  it("shows a coach only the sessions of their squads", async () => {
    await signInAs("coach2@example.com");
    const { status, json } = await history(ids.tessa);
    expect(status).toBe(200);
    const seniorSessions = (
      await env.db
        .select({ id: testingSessions.id })
        .from(testingSessions)
        .where(eq(testingSessions.squadId, ids.senior))
    ).map((s) => s.id);
    for (const test of json.tests as HistoryTestJson[])
      for (const s of test.scores) expect(seniorSessions).toContain(s.sessionId);
  });

  it("is not found for a coach of another squad and another organisation, and refused to athletes", async () => {
    await signInAs("coach@example.com");
    expect((await history(ids.tessa)).status).toBe(404);
    await signInAs("owner@other.example.com");
    expect((await history(ids.tessa)).status).toBe(404);
    await signInAs("athlete@example.com");
    expect((await history(ids.tessa)).status).toBe(403);
    await signInAs("athlete2@example.com");
    expect((await history(ids.tessa)).status).toBe(403);
  });
});

/** Scores of the latest baseline/pre-block session of the organisation with two or more usable ones. */
async function latestBaselineScores(testId: number, squadId?: number) {
  const rows = await env.db
    .select({ sessionId: results.sessionId, date: testingSessions.date, value: results.value, flag: results.flag })
    .from(results)
    .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
    .where(
      and(
        eq(results.testId, testId),
        inArray(testingSessions.phase, ["baseline", "pre-block"]),
        squadId ? eq(testingSessions.squadId, squadId) : eq(testingSessions.organizationId, 1),
      ),
    );
  const bySession = new Map<number, { date: string; values: number[] }>();
  for (const r of rows) {
    if (r.flag !== null || r.value === null) continue;
    const entry = bySession.get(r.sessionId) ?? { date: r.date, values: [] };
    entry.values.push(r.value);
    bySession.set(r.sessionId, entry);
  }
  const [sessionId, entry] = [...bySession.entries()]
    .filter(([, e]) => e.values.length >= 2)
    .sort((a, b) => b[1].date.localeCompare(a[1].date) || b[0] - a[0])[0];
  return { sessionId, ...entry };
}

type TestJson = {
  id: number;
  currentSwc?: { value: number | null; from: { sessionId: number; n: number } | null };
};

describe("Test library: SWC in the test's unit", () => {
  it("is 0.2 × the SD of the latest baseline or pre-block scores, with the session it came from", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await call(testsRoute.GET);
    expect(status).toBe(200);
    const cmj = (json.tests as TestJson[]).find((t) => t.id === ids.cmj)!;
    const ref = await latestBaselineScores(ids.cmj);
    expect(cmj.currentSwc?.from).toMatchObject({ sessionId: ref.sessionId, n: ref.values.length });
    expect(cmj.currentSwc?.value).toBeCloseTo(0.2 * sd(ref.values), 10);
  });

  it("follows a coach's reach, gives a fixed SWC as it is, and gives athletes nothing", async () => {
    await signInAs("coach@example.com");
    const coach = (await call(testsRoute.GET)).json.tests as TestJson[];
    const ref = await latestBaselineScores(ids.cmj, ids.academy);
    const cmj = coach.find((t) => t.id === ids.cmj)!;
    expect(cmj.currentSwc?.from?.sessionId).toBe(ref.sessionId);
    expect(cmj.currentSwc?.value).toBeCloseTo(0.2 * sd(ref.values), 10);
    await env.db.update(tests).set({ swcMethod: "fixed", swcValue: 0.05 }).where(eq(tests.id, ids.sprint10));
    const fixed = ((await call(testsRoute.GET)).json.tests as TestJson[]).find((t) => t.id === ids.sprint10)!;
    expect(fixed.currentSwc).toEqual({ value: 0.05, from: null });
    await env.db.update(tests).set({ swcMethod: "sd-factor", swcValue: 0.2 }).where(eq(tests.id, ids.sprint10));

    await signInAs("athlete@example.com");
    const mine = await call(testsRoute.GET);
    expect(mine.status).toBe(200);
    for (const test of mine.json.tests) expect(test).not.toHaveProperty("currentSwc");
  });
});

type Todo = {
  missingScores: { sessionId: number; missing: number; athletes: number; names: string[] }[];
  comparisons: { testId: number; fromSessionId: number; toSessionId: number; paired: number }[];
  testsWithoutTypicalError: { id: number; name: string }[];
};

describe("GET /api/work-to-do", () => {
  it("counts the missing cells of each draft: current athletes × battery without a score or a flag", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await call(todoRoute.GET);
    expect(status).toBe(200);
    const todo = json as Todo;
    const drafts = await env.db
      .select({ id: testingSessions.id, squadId: testingSessions.squadId })
      .from(testingSessions)
      .where(and(eq(testingSessions.status, "draft"), eq(testingSessions.organizationId, 1)));
    let expectedSessions = 0;
    for (const draft of drafts) {
      const battery = (
        await env.db
          .select({ testId: sessionTests.testId })
          .from(sessionTests)
          .where(eq(sessionTests.sessionId, draft.id))
      ).map((b) => b.testId);
      const members = await env.db
        .select({ id: athletes.id, name: athletes.name })
        .from(squadAthletes)
        .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
        .where(and(eq(squadAthletes.squadId, draft.squadId), eq(athletes.archived, false)));
      const filled = new Set(
        (await env.db.select().from(results).where(eq(results.sessionId, draft.id)))
          .filter((r) => r.value !== null || r.flag !== null)
          .map((r) => `${r.athleteId}:${r.testId}`),
      );
      let missing = 0;
      const who = new Set<string>();
      for (const m of members)
        for (const t of battery)
          if (!filled.has(`${m.id}:${t}`)) {
            missing++;
            who.add(m.name);
          }
      const got = todo.missingScores.find((s) => s.sessionId === draft.id);
      if (missing === 0) expect(got).toBeUndefined();
      else {
        expectedSessions++;
        expect(got).toMatchObject({ missing, athletes: who.size });
        expect(got!.names.length).toBe(Math.min(3, who.size));
        for (const name of got!.names) expect(who.has(name)).toBe(true);
      }
    }
    expect(todo.missingScores.length).toBe(expectedSessions);
  });

  it("offers each squad's pre-block/post-block pair and lists tests without a typical error", async () => {
    await signInAs("scientist@example.com");
    const todo = (await call(todoRoute.GET)).json as Todo;
    const sessions = await env.db
      .select({ id: testingSessions.id, squadId: testingSessions.squadId, phase: testingSessions.phase })
      .from(testingSessions);
    const seniorPre = sessions.find((s) => s.squadId === ids.senior && s.phase === "pre-block")!.id;
    const seniorPost = sessions.find((s) => s.squadId === ids.senior && s.phase === "post-block")!.id;
    const senior = todo.comparisons.find((c) => c.fromSessionId === seniorPre);
    expect(senior).toMatchObject({ toSessionId: seniorPost });
    const pairedOf = async (testId: number) => {
      const rows = await env.db.select().from(results).where(eq(results.testId, testId));
      const usable = (sessionId: number) =>
        new Set(
          rows.filter((r) => r.sessionId === sessionId && r.value !== null && r.flag === null).map((r) => r.athleteId),
        );
      const after = usable(seniorPost);
      return [...usable(seniorPre)].filter((a) => after.has(a)).length;
    };
    expect(senior!.paired).toBe(await pairedOf(senior!.testId));
    expect(senior!.paired).toBeGreaterThanOrEqual(2);

    const names = todo.testsWithoutTypicalError.map((t) => t.id);
    expect(names).toContain(ids.cmj);
    expect(names).not.toContain(ids.sprint30);
  });

  it("keeps to the caller's squads and is refused to athletes", async () => {
    await signInAs("coach@example.com");
    const todo = (await call(todoRoute.GET)).json as Todo;
    const academySessions = (
      await env.db
        .select({ id: testingSessions.id })
        .from(testingSessions)
        .where(eq(testingSessions.squadId, ids.academy))
    ).map((s) => s.id);
    for (const s of todo.missingScores) expect(academySessions).toContain(s.sessionId);
    for (const c of todo.comparisons) expect(academySessions).toContain(c.toSessionId);
    await signInAs("athlete@example.com");
    expect((await call(todoRoute.GET)).status).toBe(403);
  });
});
