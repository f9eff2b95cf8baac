/**
 * The Reliability check on the demo club's test–retest pair (Senior Women, baseline and retest).
 * Expected numbers are computed here from the stored scores with plain arithmetic and jStat's
 * quantiles — not with lib/stats.
 */
import { and, eq, inArray, ne } from "drizzle-orm";
import jstatPkg from "jstat";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { reliabilityStudies, results, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

type JStatLike = typeof jstatPkg & {
  noncentralt: { cdf: (x: number, dof: number, ncp: number) => number };
  centralF: { inv: (p: number, df1: number, df2: number) => number };
};
const jStat = ((jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg) as JStatLike;
const route = await import("@/app/api/reports/reliability/route");
const adoptRoute = await import("@/app/api/tests/[testId]/typical-error/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { baseline: 0, retest: 0, seniorPre: 0, academyPre: 0, cmj: 0, sprint10: 0, sprint30: 0 };

beforeAll(async () => {
  env = await setupTestDatabase();
  const sessions = await env.db
    .select({ id: testingSessions.id, phase: testingSessions.phase, squad: squads.name })
    .from(testingSessions)
    .innerJoin(squads, eq(squads.id, testingSessions.squadId));
  const find = (squad: string, phase: string) => sessions.find((s) => s.squad === squad && s.phase === phase)!.id;
  ids.baseline = find("Senior Women", "baseline");
  ids.retest = find("Senior Women", "retest");
  ids.seniorPre = find("Senior Women", "pre-block");
  ids.academyPre = find("Academy U18", "pre-block");
  const t = await env.db.select({ id: tests.id, name: tests.name }).from(tests);
  ids.cmj = t.find((x) => x.name === "Countermovement jump")!.id;
  ids.sprint10 = t.find((x) => x.name === "10 m sprint")!.id;
  ids.sprint30 = t.find((x) => x.name === "30 m sprint")!.id;
});
afterAll(() => env.cleanup());

const check = (q: Record<string, number | string>) =>
  call(route.GET, {
    url: `http://test.local/api/reports/reliability?${new URLSearchParams(Object.entries(q).map(([k, v]) => [k, String(v)]))}`,
  });
const study = (testId: number, confidence = 0.95) =>
  check({ testId, firstSessionId: ids.baseline, secondSessionId: ids.retest, confidence });
const adopt = (testId: number, body: unknown) =>
  call(adoptRoute.POST, { method: "POST", params: { testId: `${testId}` }, body });

/** Unflagged pairs straight from the results table. */
async function storedPairs(testId: number) {
  const rows = await env.db
    .select({ sessionId: results.sessionId, athleteId: results.athleteId, value: results.value, flag: results.flag })
    .from(results)
    .where(eq(results.testId, testId));
  const side = (sessionId: number) =>
    new Map(
      rows
        .filter((r) => r.sessionId === sessionId && r.flag === null && r.value !== null)
        .map((r) => [r.athleteId, r.value as number]),
    );
  const a = side(ids.baseline);
  const b = side(ids.retest);
  return [...a.keys()].filter((id) => b.has(id)).map((id) => ({ id, first: a.get(id)!, second: b.get(id)! }));
}

const sum = (x: number[]) => x.reduce((a, b) => a + b, 0);
const avg = (x: number[]) => sum(x) / x.length;
const sd = (x: number[]) => Math.sqrt(sum(x.map((v) => (v - avg(x)) ** 2)) / (x.length - 1));
const near = (actual: number, expected: number, rel = 1e-6) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected) + 1e-9);

/** Two-way (athletes × days) mean squares, Shrout & Fleiss (1979) ICC(3,1) and McGraw & Wong (1996) ICC(2,1). */
function iccs(first: number[], second: number[], confidence: number) {
  const n = first.length;
  const k = 2;
  const grand = avg([...first, ...second]);
  const rowMeans = first.map((f, i) => (f + second[i]) / 2);
  const ssr = k * sum(rowMeans.map((m) => (m - grand) ** 2));
  const ssc = n * ((avg(first) - grand) ** 2 + (avg(second) - grand) ** 2);
  const sst = sum([...first, ...second].map((v) => (v - grand) ** 2));
  const msr = ssr / (n - 1);
  const msc = ssc / (k - 1);
  const mse = (sst - ssr - ssc) / ((n - 1) * (k - 1));
  const p = 1 - (1 - confidence) / 2;
  const icc31 = (msr - mse) / (msr + (k - 1) * mse);
  const f0 = msr / mse;
  const fl = f0 / jStat.centralF.inv(p, n - 1, (n - 1) * (k - 1));
  const fu = f0 * jStat.centralF.inv(p, (n - 1) * (k - 1), n - 1);
  const icc21 = (msr - mse) / (msr + (k - 1) * mse + (k * (msc - mse)) / n);
  return { icc31, icc31Lower: (fl - 1) / (fl + k - 1), icc31Upper: (fu - 1) / (fu + k - 1), icc21, mse };
}

/** Two-sided paired-t power for n athletes (noncentral t). */
function pairedPower(n: number, sdDiff: number, delta: number) {
  const df = n - 1;
  const crit = jStat.studentt.inv(0.975, df);
  const ncp = delta / (sdDiff / Math.sqrt(n));
  return 1 - jStat.noncentralt.cdf(crit, df, ncp) + jStat.noncentralt.cdf(-crit, df, ncp);
}

describe("GET /api/reports/reliability", () => {
  it("agrees with an independent calculation for the CMJ and the 10 m sprint", async () => {
    await signInAs("scientist@example.com");
    for (const testId of [ids.cmj, ids.sprint10]) {
      for (const confidence of [0.9, 0.95]) {
        const { status, json } = await study(testId, confidence);
        expect(status).toBe(200);
        const pairs = await storedPairs(testId);
        const first = pairs.map((p) => p.first);
        const second = pairs.map((p) => p.second);
        const d = pairs.map((p) => p.second - p.first);
        const n = pairs.length;
        expect(json.n).toBe(n);
        expect(json.df).toBe(n - 1);
        expect(json.pairs.map((p: { athleteId: number }) => p.athleteId).sort()).toEqual(pairs.map((p) => p.id).sort());

        // Typical error = SD(diff)/√2 with chi-square limits on n − 1 df (Hopkins 2000).
        const te = sd(d) / Math.SQRT2;
        near(json.typicalError, te, 1e-10);
        const alpha = 1 - confidence;
        near(json.typicalErrorLower, te * Math.sqrt((n - 1) / jStat.chisquare.inv(1 - alpha / 2, n - 1)));
        near(json.typicalErrorUpper, te * Math.sqrt((n - 1) / jStat.chisquare.inv(alpha / 2, n - 1)));

        // CV% from logs: 100·(e^{SD(ln y2 − ln y1)/√2} − 1).
        const s = sd(pairs.map((p) => Math.log(p.second) - Math.log(p.first))) / Math.SQRT2;
        near(json.cvPercent, 100 * (Math.exp(s) - 1), 1e-10);

        // Change in mean with its paired t-interval.
        const q = jStat.studentt.inv(1 - alpha / 2, n - 1);
        near(json.changeInMean, avg(d), 1e-10);
        near(json.changeLower, avg(d) - (q * sd(d)) / Math.sqrt(n));
        near(json.changeUpper, avg(d) + (q * sd(d)) / Math.sqrt(n));

        // ICCs from two-way mean squares; for two days √MSE is the typical error too.
        const ref = iccs(first, second, confidence);
        near(Math.sqrt(ref.mse), te, 1e-9);
        near(json.icc31, ref.icc31, 1e-9);
        near(json.icc31Lower, ref.icc31Lower);
        near(json.icc31Upper, ref.icc31Upper);
        near(json.icc21, ref.icc21, 1e-9);
        expect(json.icc21Lower).toBeLessThan(json.icc21);
        expect(json.icc21Upper).toBeGreaterThan(json.icc21);
        const band = ref.icc31 < 0.5 ? "poor" : ref.icc31 < 0.75 ? "moderate" : ref.icc31 < 0.9 ? "good" : "excellent";
        expect(json.iccReading).toBe(band);

        // SWC: the test's own method, 0.2 × SD of the first session's scores.
        const swc = 0.2 * sd(first);
        near(json.swc, swc, 1e-10);
        near(json.sensitivity.ratio, te / swc, 1e-10);
        expect(json.sensitivity.rating).toBe(te / swc < 0.8 ? "detects" : te / swc <= 1.2 ? "borderline" : "blind");
        let k = 1;
        while (!(te / Math.sqrt(k) < swc)) k++;
        expect(json.trialsNeeded).toBe(k);

        // Athletes for 80 % power with SD of changes √2·TE: the smallest n that reaches it.
        const needed = json.athletesNeeded;
        expect(pairedPower(needed, Math.SQRT2 * te, swc)).toBeGreaterThanOrEqual(0.8 - 1e-6);
        if (needed > 2) expect(pairedPower(needed - 1, Math.SQRT2 * te, swc)).toBeLessThan(0.8 + 1e-6);
        const at = (power: number) => json.planner.find((p: { power: number }) => p.power === power).athletes;
        expect(at(0.8)).toBe(needed);
        expect(at(0.7)).toBeLessThanOrEqual(needed);
        expect(at(0.95)).toBeGreaterThanOrEqual(at(0.9));

        // Limits of agreement: bias ± 1.96·SD(diff).
        near(json.limitsOfAgreement.lower, avg(d) - jStat.normal.inv(0.975, 0, 1) * sd(d));
        expect(json.test).toMatchObject({ id: testId });
      }
    }
  });

  it("leaves out flagged and missing scores and lists them", async () => {
    await signInAs("owner@example.com");
    const [athlete] = (await storedPairs(ids.cmj)).map((p) => p.id);
    const before = (await study(ids.cmj)).json;
    await env.db
      .update(results)
      .set({ flag: "injured" })
      .where(and(eq(results.sessionId, ids.retest), eq(results.testId, ids.cmj), eq(results.athleteId, athlete)));
    const after = (await study(ids.cmj)).json;
    expect(after.n).toBe(before.n - 1);
    expect(after.pairs.some((p: { athleteId: number }) => p.athleteId === athlete)).toBe(false);
    expect(after.excluded).toContainEqual(expect.objectContaining({ athleteId: athlete, reason: "flagged-post" }));
    await env.db
      .update(results)
      .set({ flag: null })
      .where(and(eq(results.sessionId, ids.retest), eq(results.testId, ids.cmj), eq(results.athleteId, athlete)));
  });

  it("answers 422 for settings that cannot make a study", async () => {
    await signInAs("scientist@example.com");
    const base = { testId: ids.cmj, firstSessionId: ids.baseline, secondSessionId: ids.retest };
    const cases: Record<string, number | string>[] = [
      { ...base, secondSessionId: ids.academyPre }, // another squad
      { ...base, testId: ids.sprint30 }, // not in both batteries
      { ...base, secondSessionId: ids.baseline }, // the same session twice
      { ...base, confidence: 0.5 },
      { ...base, testId: "06" },
      { firstSessionId: ids.baseline, secondSessionId: ids.retest },
    ];
    for (const q of cases) expect((await check(q)).status, JSON.stringify(q)).toBe(422);
  });

  it("keeps to managers and reach: coaches 403, athletes 403, another organisation 404", async () => {
    for (const who of ["coach2@example.com", "coach@example.com", "athlete@example.com"]) {
      await signInAs(who);
      expect((await study(ids.cmj)).status, who).toBe(403);
      expect((await adopt(ids.cmj, { firstSessionId: ids.baseline, secondSessionId: ids.retest })).status).toBe(403);
    }
    await signInAs("owner@other.example.com");
    expect((await study(ids.cmj)).status).toBe(404);
    expect((await adopt(ids.cmj, { firstSessionId: ids.baseline, secondSessionId: ids.retest })).status).toBe(404);
  });
});

describe("POST /api/tests/[testId]/typical-error", () => {
  it("adopts the measured typical error: version + 1, TE, df, source, and a study row", async () => {
    await signInAs("scientist@example.com");
    const [before] = await env.db.select().from(tests).where(eq(tests.id, ids.sprint10));
    const measured = (await study(ids.sprint10)).json;
    const { status, json } = await adopt(ids.sprint10, { firstSessionId: ids.baseline, secondSessionId: ids.retest });
    expect(status).toBe(200);
    const te = sd((await storedPairs(ids.sprint10)).map((p) => p.second - p.first)) / Math.SQRT2;
    expect(json.test.version).toBe(before.version + 1);
    near(json.test.typicalError, te, 1e-10);
    expect(json.test.typicalErrorDf).toBe(measured.n - 1);
    expect(json.test.typicalErrorSource).toBe(`Measured: Senior Women, 24 Aug 2026 & 27 Aug 2026, n = ${measured.n}`);
    const [stored] = await env.db.select().from(tests).where(eq(tests.id, ids.sprint10));
    expect(stored.version).toBe(before.version + 1);
    const rows = await env.db.select().from(reliabilityStudies).where(eq(reliabilityStudies.testId, ids.sprint10));
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      firstSessionId: ids.baseline,
      secondSessionId: ids.retest,
      n: measured.n,
      typicalErrorDf: measured.n - 1,
    });
    near(rows[0].typicalError, te, 1e-10);
    expect(rows[0].adoptedAt).toBeInstanceOf(Date);
    // The check now shows the test's adopted value beside the measured one.
    expect((await study(ids.sprint10)).json.test.typicalErrorSource).toMatch(/^Measured: Senior Women/);
  });

  it("answers 422 for a body that names no study", async () => {
    await signInAs("owner@example.com");
    for (const body of [
      {},
      { firstSessionId: ids.baseline },
      { firstSessionId: ids.baseline, secondSessionId: ids.baseline },
      { firstSessionId: "1", secondSessionId: ids.retest },
    ])
      expect((await adopt(ids.cmj, body)).status, JSON.stringify(body)).toBe(422);
    expect((await adopt(ids.sprint30, { firstSessionId: ids.baseline, secondSessionId: ids.retest })).status).toBe(422);
  });

  it("answers 422 when fewer than two athletes have a score on both days", async () => {
    await signInAs("owner@example.com");
    const [keep] = (await storedPairs(ids.cmj)).map((p) => p.id);
    await env.db
      .update(results)
      .set({ flag: "absent" })
      .where(and(eq(results.sessionId, ids.retest), eq(results.testId, ids.cmj), ne(results.athleteId, keep)));
    const { status, json } = await study(ids.cmj);
    expect(status).toBe(422);
    expect(json.error.message).toMatch(/two athletes/);
    const [before] = await env.db
      .select()
      .from(tests)
      .where(inArray(tests.id, [ids.cmj]));
    expect((await adopt(ids.cmj, { firstSessionId: ids.baseline, secondSessionId: ids.retest })).status).toBe(422);
    const [after] = await env.db.select().from(tests).where(eq(tests.id, ids.cmj));
    expect(after.version).toBe(before.version);
  });
});
