/**
 * GET /api/reports/change on the demo club. Expected numbers are computed here from the stored
 * scores with plain arithmetic and jStat's t quantile — not with lib/stats.
 */
import { and, eq } from "drizzle-orm";
import jstatPkg from "jstat";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, results, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const jStat = (jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg;
const route = await import("@/app/api/reports/change/route");
const csvRoute = await import("@/app/api/reports/change.csv/route");
const savedRoute = await import("@/app/api/reports/notes/route");
const savedOneRoute = await import("@/app/api/reports/notes/[reportId]/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = {
  seniorPre: 0,
  seniorPost: 0,
  academyPre: 0,
  academyPost: 0,
  seniorBaseline: 0,
  cmj: 0,
  sprint10: 0,
  sprint30: 0,
  squat: 0,
};

beforeAll(async () => {
  env = await setupTestDatabase();
  const sessions = await env.db
    .select({ id: testingSessions.id, phase: testingSessions.phase, squad: squads.name })
    .from(testingSessions)
    .innerJoin(squads, eq(squads.id, testingSessions.squadId));
  const find = (squad: string, phase: string) => sessions.find((s) => s.squad === squad && s.phase === phase)!.id;
  ids.seniorPre = find("Senior Women", "pre-block");
  ids.seniorPost = find("Senior Women", "post-block");
  ids.seniorBaseline = find("Senior Women", "baseline");
  ids.academyPre = find("Academy U18", "pre-block");
  ids.academyPost = find("Academy U18", "post-block");
  const t = await env.db.select({ id: tests.id, name: tests.name }).from(tests);
  ids.cmj = t.find((x) => x.name === "Countermovement jump")!.id;
  ids.sprint10 = t.find((x) => x.name === "10 m sprint")!.id;
  ids.sprint30 = t.find((x) => x.name === "30 m sprint")!.id;
  ids.squat = t.find((x) => x.name === "Back squat 1RM")!.id;
});
afterAll(() => env.cleanup());

const report = (q: Record<string, number | string>) =>
  call(route.GET, {
    url: `http://test.local/api/reports/change?${new URLSearchParams(Object.entries(q).map(([k, v]) => [k, String(v)]))}`,
  });

/** Pairs stored values (unflagged, both present) straight from the results table. */
async function storedPairs(testId: number, fromId: number, toId: number) {
  const rows = await env.db
    .select({ sessionId: results.sessionId, athleteId: results.athleteId, value: results.value, flag: results.flag })
    .from(results)
    .where(and(eq(results.testId, testId)));
  const side = (sessionId: number) =>
    new Map(
      rows
        .filter((r) => r.sessionId === sessionId && r.flag === null && r.value !== null)
        .map((r) => [r.athleteId, r.value as number]),
    );
  const pre = side(fromId);
  const post = side(toId);
  return [...pre.keys()].filter((id) => post.has(id)).map((id) => ({ id, pre: pre.get(id)!, post: post.get(id)! }));
}

function tInterval(d: number[], confidence: number) {
  const n = d.length;
  const mean = d.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(d.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
  const q = jStat.studentt.inv(1 - (1 - confidence) / 2, n - 1);
  const se = sd / Math.sqrt(n);
  return {
    mean,
    sd,
    q,
    lower: mean - q * se,
    upper: mean + q * se,
    t: mean / se,
    p: 2 * (1 - jStat.studentt.cdf(Math.abs(mean / se), n - 1)),
  };
}

describe("GET /api/reports/change", () => {
  it("agrees with an independent paired t calculation for the CMJ (higher is better)", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await report({
      testId: ids.cmj,
      fromSessionId: ids.seniorPre,
      toSessionId: ids.seniorPost,
      confidence: 0.9,
    });
    expect(status).toBe(200);
    const pairs = await storedPairs(ids.cmj, ids.seniorPre, ids.seniorPost);
    const d = pairs.map((p) => p.post - p.pre);
    const ref = tInterval(d, 0.9);
    expect(json.squad.n).toBe(pairs.length);
    expect(json.squad.df).toBe(pairs.length - 1);
    expect(json.squad.meanDiff).toBeCloseTo(ref.mean, 10);
    expect(json.squad.sdDiff).toBeCloseTo(ref.sd, 10);
    // jStat's t quantile and cdf are good to about 1e-7 (PRODUCT.md §9 holds t quantiles to 1e-6).
    expect(Math.abs(json.squad.tCritical - ref.q) / ref.q).toBeLessThan(1e-6);
    expect(Math.abs(json.squad.ciLower - ref.lower)).toBeLessThan(1e-6 * Math.abs(ref.lower) + 1e-9);
    expect(Math.abs(json.squad.ciUpper - ref.upper)).toBeLessThan(1e-6 * Math.abs(ref.upper) + 1e-9);
    expect(json.squad.t).toBeCloseTo(ref.t, 9);
    expect(Math.abs(json.squad.p - ref.p)).toBeLessThan(1e-6);
    // SWC 0.2 × SD of the paired athletes' pre scores (Hopkins 2004; the test's default method)
    const pre = pairs.map((p) => p.pre);
    const meanPre = pre.reduce((a, b) => a + b, 0) / pre.length;
    const sdPre = Math.sqrt(pre.reduce((a, b) => a + (b - meanPre) ** 2, 0) / (pre.length - 1));
    expect(json.squad.swc).toBeCloseTo(0.2 * sdPre, 10);
    expect(json.settings).toMatchObject({ confidence: 0.9, swcMethod: "sd-factor", swcSource: "test" });
    expect(json.test).toMatchObject({ id: ids.cmj, unit: "cm", direction: "higher" });
    expect(json.athletes.length).toBe(pairs.length);
  });

  it("orients sprint times: a faster post-block time is a gain, for both sprint tests", async () => {
    await signInAs("scientist@example.com");
    for (const testId of [ids.sprint10, ids.sprint30]) {
      const { json } = await report({
        testId,
        fromSessionId: ids.seniorPre,
        toSessionId: ids.seniorPost,
        confidence: 0.9,
      });
      const faster = json.athletes.find((a: { change: number }) => a.change < 0);
      expect(faster.betterChange).toBeCloseTo(-faster.change, 12);
      const { lower, upper } = { lower: -json.squad.ciUpper, upper: -json.squad.ciLower };
      const swc = json.squad.swc;
      const expected =
        lower > swc
          ? "clear-gain"
          : upper < -swc
            ? "clear-decline"
            : lower >= -swc && upper <= swc
              ? "steady"
              : lower > 0
                ? "gain"
                : upper < 0
                  ? "decline"
                  : "inconclusive";
      expect(json.squad.verdict).toBe(expected);
    }
  });

  it("lists the flagged and the missing as excluded, never drops them", async () => {
    await signInAs("scientist@example.com");
    const { json } = await report({ testId: ids.squat, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost });
    const stored = await storedPairs(ids.squat, ids.seniorPre, ids.seniorPost);
    expect(json.athletes.length).toBe(stored.length);
    expect(json.excluded.length).toBeGreaterThan(0);
    expect(
      json.excluded.every((e: { reason: string }) =>
        ["no-pre", "no-post", "flagged-pre", "flagged-post"].includes(e.reason),
      ),
    ).toBe(true);
    expect(json.athletes.length + json.excluded.length).toBeGreaterThanOrEqual(18);
  });

  it("gives per-athlete intervals only when the test has a typical error", async () => {
    await signInAs("scientist@example.com");
    const withTe = await report({ testId: ids.sprint30, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost });
    expect(withTe.json.test.typicalError).not.toBeNull();
    const a = withTe.json.athletes[0];
    const q = jStat.studentt.inv(0.95, withTe.json.test.typicalErrorDf);
    expect(Math.abs(a.ciUpper - (a.change + q * Math.SQRT2 * withTe.json.test.typicalError))).toBeLessThan(1e-6);
    expect(a.verdict).not.toBeNull();
    const without = await report({ testId: ids.cmj, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost });
    expect(
      without.json.athletes.every(
        (x: { verdict: unknown; ciLower: unknown }) => x.verdict === null && x.ciLower === null,
      ),
    ).toBe(true);
    expect(without.json.squad.individualResponseSd).toBeNull();
  });

  it("answers 422 for bad settings, different squads, a test outside both batteries", async () => {
    await signInAs("scientist@example.com");
    const base = { testId: ids.cmj, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost };
    expect((await report({ ...base, confidence: 0.5 })).status).toBe(422);
    expect((await report({ ...base, toSessionId: ids.seniorPre })).status).toBe(422);
    expect((await report({ ...base, swcMethod: "fixed" })).status).toBe(422);
    expect((await report({ ...base, fromSessionId: "6.0" })).status).toBe(422);
    expect((await report({ ...base, toSessionId: ids.academyPost })).status).toBe(422);
    // The baseline session measured only CMJ and 10 m sprint.
    expect(
      (await report({ testId: ids.squat, fromSessionId: ids.seniorBaseline, toSessionId: ids.seniorPost })).status,
    ).toBe(422);
    const fixed = await report({ ...base, swcMethod: "fixed", swcValue: "1,5" });
    expect(fixed.status).toBe(200);
    expect(fixed.json.squad.swc).toBe(1.5);
    expect(fixed.json.settings.swcSource).toBe("report");
  });

  it("keeps to reach: athletes 403, a coach of another squad 404, another organisation 404", async () => {
    const q = { testId: ids.cmj, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost };
    await signInAs("athlete@example.com");
    expect((await report(q)).status).toBe(403);
    await signInAs("coach@example.com"); // coaches the Academy only
    const outside = await report(q);
    expect(outside.status).toBe(404);
    expect(JSON.stringify(outside.json)).not.toContain("Senior");
    expect(
      (await report({ testId: ids.cmj, fromSessionId: ids.academyPre, toSessionId: ids.academyPost })).status,
    ).toBe(200);
    await signInAs("owner@other.example.com");
    expect((await report(q)).status).toBe(404);
  });

  it("exports the same numbers as CSV, with cells a spreadsheet would execute neutralised", async () => {
    await signInAs("scientist@example.com");
    const [first] = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Maren Oduya"));
    await env.db.update(athletes).set({ name: '=HYPERLINK("http://x","y")' }).where(eq(athletes.id, first.id));
    const q = new URLSearchParams({
      testId: `${ids.cmj}`,
      fromSessionId: `${ids.seniorPre}`,
      toSessionId: `${ids.seniorPost}`,
    });
    const response = await csvRoute.GET(new Request(`http://test.local/api/reports/change.csv?${q}`), {
      params: Promise.resolve({}),
    });
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toContain("text/csv");
    const text = await response.text();
    const { json } = await report({ testId: ids.cmj, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost });
    // OWASP "CSV Injection": a leading = is prefixed with ' and the field quoted (RFC 4180).
    expect(text).toContain(`"'=HYPERLINK(""http://x"",""y"")"`);
    expect(text).not.toMatch(/^=|,=/m);
    expect(text).toContain(`Mean change (second − first),${json.squad.meanDiff},cm`);
    expect(
      text.split("\r\n").filter((l) => /^[^,]+,-?\d/.test(l) && !l.startsWith("Athletes") && !l.startsWith("Degrees"))
        .length,
    ).toBeGreaterThan(5);
    await env.db.update(athletes).set({ name: "Maren Oduya" }).where(eq(athletes.id, first.id));
  });

  it("saves a note with a snapshot that reopens unchanged after a score changes, and says the data changed", async () => {
    const settings = { testId: ids.cmj, fromSessionId: ids.seniorPre, toSessionId: ids.seniorPost, confidence: 0.9 };
    await signInAs("coach@example.com");
    expect(
      (await call(savedRoute.POST, { method: "POST", body: { ...settings, note: "Coaches read notes." } })).status,
    ).toBe(403);
    await signInAs("scientist@example.com");
    expect((await call(savedRoute.POST, { method: "POST", body: { ...settings, note: "\u200b " } })).status).toBe(422);
    const saved = await call(savedRoute.POST, {
      method: "POST",
      body: { ...settings, note: "Jump height up across the squad; two athletes to watch." },
    });
    expect(saved.status).toBe(201);
    const id = `${saved.json.report.id}`;
    const first = await call(savedOneRoute.GET, { params: { reportId: id } });
    expect(first.json.report.changedSince).toBe(false);
    expect(first.json.report.note).toContain("two athletes to watch");
    const live = await report(settings);
    expect(first.json.report.snapshot.squad).toEqual(live.json.squad);

    // A score changes after the report was written.
    const [row] = await env.db
      .select({ id: results.id, value: results.value })
      .from(results)
      .where(and(eq(results.sessionId, ids.seniorPost), eq(results.testId, ids.cmj)));
    await env.db
      .update(results)
      .set({ value: (row.value ?? 30) + 5 })
      .where(eq(results.id, row.id));
    const reopened = await call(savedOneRoute.GET, { params: { reportId: id } });
    expect(reopened.json.report.changedSince).toBe(true);
    expect(reopened.json.report.snapshot).toEqual(first.json.report.snapshot);
    await env.db.update(results).set({ value: row.value }).where(eq(results.id, row.id));

    const list = await call(savedRoute.GET, {
      url: `http://test.local/api/reports/notes?squadId=${first.json.report.squadId}`,
    });
    expect(list.json.reports.map((r: { id: number }) => r.id)).toContain(Number(id));
    // The Academy coach reaches neither the list nor the report of another squad.
    await signInAs("coach@example.com");
    expect((await call(savedOneRoute.GET, { params: { reportId: id } })).status).toBe(404);
    expect((await call(savedRoute.GET)).json.reports.some((r: { id: number }) => r.id === Number(id))).toBe(false);
  });
});
