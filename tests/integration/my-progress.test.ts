/**
 * My progress (GET /api/me/progress), the data-rights export (GET /api/me/export) and the consent
 * rule, on the demo club with its post-block session published. Expected numbers are computed here
 * from the stored scores with plain arithmetic and jStat's t quantile — not with lib/stats.
 */
import { and, eq, inArray, ne } from "drizzle-orm";
import jstatPkg from "jstat";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, results, sessionTests, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const jStat = (jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg;
const progressRoute = await import("@/app/api/me/progress/route");
const exportRoute = await import("@/app/api/me/export/route");
const resultsRoute = await import("@/app/api/athletes/[athleteId]/results/route");
const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { tessa: 0, priya: 0, senior: 0, pre: 0, post: 0, sprint30: 0, baseline: 0, retest: 0 };

const progress = async () => call(progressRoute.GET);
const exportAs = (format: string) => call(exportRoute.GET, { url: `http://test.local/api/me/export?format=${format}` });

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
  return Math.sqrt(xs.reduce((a, x) => a + (x - m) ** 2, 0) / (xs.length - 1));
};

async function publish(sessionId: number) {
  const [row] = await env.db
    .select({ version: testingSessions.version })
    .from(testingSessions)
    .where(eq(testingSessions.id, sessionId));
  await signInAs("scientist@example.com");
  const answer = await call(sessionRoute.PATCH, {
    method: "PATCH",
    params: { sessionId: `${sessionId}` },
    body: { status: "published", version: row.version },
  });
  expect(answer.status).toBe(200);
}

const setConsent = (athleteId: number, values: Partial<typeof athletes.$inferInsert>) =>
  env.db.update(athletes).set(values).where(eq(athletes.id, athleteId));

beforeAll(async () => {
  env = await setupTestDatabase();
  const named = async (name: string) =>
    (await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, name)))[0].id;
  ids.tessa = await named("Tessa Lindqvist");
  ids.priya = await named("Priya Damaschke");
  ids.senior = (await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women")))[0].id;
  ids.sprint30 = (await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "30 m sprint")))[0].id;
  const sessions = await env.db
    .select({ id: testingSessions.id, phase: testingSessions.phase })
    .from(testingSessions)
    .where(eq(testingSessions.squadId, ids.senior));
  const phase = (p: string) => sessions.find((s) => s.phase === p)!.id;
  ids.pre = phase("pre-block");
  ids.post = phase("post-block");
  ids.baseline = phase("baseline");
  ids.retest = phase("retest");
  // Tessa ran 0.20 s faster after the block: a falling time, which must read as a gain.
  const [pre] = await env.db
    .select({ value: results.value })
    .from(results)
    .where(and(eq(results.sessionId, ids.pre), eq(results.athleteId, ids.tessa), eq(results.testId, ids.sprint30)));
  const faster = Math.round((pre.value! - 0.2) * 100) / 100;
  await env.db
    .update(results)
    .set({ trials: [faster], value: faster })
    .where(and(eq(results.sessionId, ids.post), eq(results.athleteId, ids.tessa), eq(results.testId, ids.sprint30)));
  await publish(ids.post);
});
afterAll(() => env.cleanup());

describe("GET /api/me/progress", () => {
  it("reads a faster sprint time as a gain, with the interval, SWC and verdict computed independently", async () => {
    await signInAs("athlete@example.com");
    const { status, json } = await progress();
    expect(status).toBe(200);
    const sprint = json.tests.find((t: { id: number }) => t.id === ids.sprint30);
    const scoreOf = async (sessionId: number) =>
      (
        await env.db
          .select({ value: results.value })
          .from(results)
          .where(
            and(eq(results.sessionId, sessionId), eq(results.athleteId, ids.tessa), eq(results.testId, ids.sprint30)),
          )
      )[0].value!;
    const pre = await scoreOf(ids.pre);
    const post = await scoreOf(ids.post);
    // The squad's spread in the session the change starts from: every usable 30 m time that day.
    const squadPre = (
      await env.db
        .select({ value: results.value, flag: results.flag })
        .from(results)
        .where(and(eq(results.sessionId, ids.pre), eq(results.testId, ids.sprint30)))
    )
      .filter((r) => r.flag === null && r.value !== null)
      .map((r) => r.value!);
    expect(squadPre.length).toBeGreaterThanOrEqual(10);
    const swc = 0.2 * sd(squadPre);
    // TE 0.045 s on 24 df (the demo's 30 m sprint). t(0.95, 24) = 1.711 in the NIST/SEMATECH
    // e-Handbook's table of critical values of Student's t (§1.3.6.7.2).
    const t = jStat.studentt.inv(0.95, 24);
    expect(t).toBeCloseTo(1.711, 3);
    const half = t * Math.SQRT2 * 0.045;
    const change = post - pre;
    expect(change).toBeLessThan(0);
    const latest = sprint.latest;
    expect(latest.sessionId).toBe(ids.post);
    expect(latest.previousSessionId).toBe(ids.pre);
    expect(latest.change).toBeCloseTo(change, 9);
    expect(latest.betterChange).toBeCloseTo(pre - post, 9);
    expect(latest.betterChange).toBeGreaterThan(0);
    // t quantiles agree to 1e-6 (PRODUCT.md §9); jStat's own inverse is no closer than that.
    expect(latest.ciLower).toBeCloseTo(change - half, 6);
    expect(latest.ciUpper).toBeCloseTo(change + half, 6);
    expect(latest.swc).toBeCloseTo(swc, 9);
    expect(latest.verdict).toBe(verdictOf(-(change + half), -(change - half), swc));
    expect(latest.verdict).toBe("clear-gain");
    expect(sprint.swcBasis).toBe("squad");
    // Personal best of a lower-is-better test: the fastest time.
    expect(sprint.best.value).toBe(Math.min(pre, post));
  });

  it("holds only published sessions and only the athlete's own scores: no other athlete's name or value", async () => {
    await signInAs("athlete@example.com");
    const { json } = await progress();
    const text = JSON.stringify(json);
    const sessionIds = new Set(json.tests.flatMap((t: any) => t.scores.map((s: any) => s.sessionId)));
    expect([...sessionIds].sort()).toEqual([ids.pre, ids.post].sort());
    for (const s of json.tests.flatMap((t: any) => t.scores)) expect(s.status).toBe("published");
    expect(text).not.toContain("2026-08-24");
    expect(text).not.toContain("2026-08-27");
    const others = await env.db.select({ name: athletes.name }).from(athletes).where(ne(athletes.id, ids.tessa));
    expect(others.length).toBeGreaterThan(30);
    for (const { name } of others) expect(text).not.toContain(name);
    const own = await env.db
      .select({ sessionId: results.sessionId, testId: results.testId, value: results.value })
      .from(results)
      .where(eq(results.athleteId, ids.tessa));
    for (const test of json.tests) {
      for (const s of test.scores) {
        const stored = own.find((r) => r.sessionId === s.sessionId && r.testId === test.id);
        expect(s.value).toBe(stored?.value ?? null);
      }
    }
  });

  it("answers athletes only: staff get 403, signed-out callers 401", async () => {
    for (const email of ["owner@example.com", "scientist@example.com", "coach2@example.com"]) {
      await signInAs(email);
      expect((await progress()).status).toBe(403);
      expect((await exportAs("json")).status).toBe(403);
    }
    await signInAs(null);
    expect((await progress()).status).toBe(401);
  });

  it("gives no squad-based SWC where the squad's scores would give a team-mate's away (a squad of two)", async () => {
    // Priya and one invented team-mate in a squad of their own, tested twice in the 30 m sprint.
    const [duo] = await env.db
      .insert(squads)
      .values({ organizationId: (await orgId()) as number, name: "Sprint Duo" })
      .returning({ id: squads.id });
    const [mate] = await env.db
      .insert(athletes)
      .values({ organizationId: await orgId(), name: "Wilhelmina Duo-Mate", consentRecordedOn: "2026-08-20" })
      .returning({ id: athletes.id });
    await env.db.insert(squadAthletes).values([
      { squadId: duo.id, athleteId: ids.priya },
      { squadId: duo.id, athleteId: mate.id },
    ]);
    const scores = { first: { priya: 4.61, mate: 4.37 }, second: { priya: 4.52, mate: 4.29 } };
    const made: number[] = [];
    for (const [date, day] of [
      ["2026-12-01", scores.first],
      ["2026-12-08", scores.second],
    ] as const) {
      const [s] = await env.db
        .insert(testingSessions)
        .values({ organizationId: await orgId(), squadId: duo.id, date, phase: "in-season", status: "published" })
        .returning({ id: testingSessions.id });
      made.push(s.id);
      await env.db.insert(sessionTests).values({ sessionId: s.id, testId: ids.sprint30 });
      await env.db.insert(results).values([
        {
          organizationId: await orgId(),
          sessionId: s.id,
          athleteId: ids.priya,
          testId: ids.sprint30,
          trials: [day.priya],
          value: day.priya,
        },
        {
          organizationId: await orgId(),
          sessionId: s.id,
          athleteId: mate.id,
          testId: ids.sprint30,
          trials: [day.mate],
          value: day.mate,
        },
      ]);
    }
    await signInAs("athlete2@example.com");
    const { json } = await progress();
    const sprint = json.tests.find((t: { id: number }) => t.id === ids.sprint30);
    expect(sprint.latest.sessionId).toBe(made[1]);
    expect(sprint.latest.change).toBeCloseTo(4.52 - 4.61, 9);
    // A squad of two: no SWC, no verdict — 0.2 × SD would be 0.2 × |4.61 − 4.37| / √2.
    expect(sprint.latest.swc).toBeNull();
    expect(sprint.latest.verdict).toBeNull();
    const text = JSON.stringify(json);
    expect(text).not.toContain("Duo-Mate");
    for (const v of [4.37, 4.29, 0.2 * (0.24 / Math.SQRT2)]) expect(text).not.toContain(String(v));

    // A fixed SWC reveals nothing of anyone: then the same change gets its verdict.
    await env.db.update(tests).set({ swcMethod: "fixed", swcValue: 0.05 }).where(eq(tests.id, ids.sprint30));
    const fixed = (await progress()).json.tests.find((t: { id: number }) => t.id === ids.sprint30);
    expect(fixed.swcBasis).toBe("fixed");
    expect(fixed.latest.swc).toBe(0.05);
    const half = jStat.studentt.inv(0.95, 24) * Math.SQRT2 * 0.045;
    const change = 4.52 - 4.61;
    expect(fixed.latest.verdict).toBe(verdictOf(-(change + half), -(change - half), 0.05));
    await env.db.update(tests).set({ swcMethod: "sd-factor", swcValue: 0.2 }).where(eq(tests.id, ids.sprint30));
    await env.db.delete(squadAthletes).where(eq(squadAthletes.squadId, duo.id));
    await env.db.delete(testingSessions).where(inArray(testingSessions.id, made));
  });
});

async function orgId() {
  return (await env.db.select({ id: athletes.organizationId }).from(athletes).where(eq(athletes.id, ids.tessa)))[0].id;
}

describe("consent", () => {
  const years = (n: number) => {
    const d = new Date();
    return `${d.getUTCFullYear() - n}-${String(d.getUTCMonth() + 1).padStart(2, "0")}-01`;
  };

  it("shows nothing to an athlete whose consent is not recorded, and says why", async () => {
    await setConsent(ids.tessa, { consentRecordedOn: null });
    await signInAs("athlete@example.com");
    const { json } = await progress();
    expect(json.consent).toEqual({ ok: false, minor: false, missing: ["athlete"] });
    expect(json.tests).toEqual([]);
    const listed = await call(resultsRoute.GET, { params: { athleteId: `${ids.tessa}` } });
    expect(listed.json.results).toEqual([]);
    await setConsent(ids.tessa, { consentRecordedOn: "2026-08-20" });
    expect((await progress()).json.tests.length).toBeGreaterThan(0);
  });

  it("a minor needs a guardian's consent as well: without it, nothing; with it, their results", async () => {
    await setConsent(ids.tessa, { dateOfBirth: years(16), consentRecordedOn: "2026-08-20", guardianConsentOn: null });
    await signInAs("athlete@example.com");
    const without = (await progress()).json;
    expect(without.consent).toEqual({ ok: false, minor: true, missing: ["guardian"] });
    expect(without.tests).toEqual([]);
    expect((await call(resultsRoute.GET, { params: { athleteId: `${ids.tessa}` } })).json.results).toEqual([]);
    await setConsent(ids.tessa, { guardianConsentOn: "2026-08-21" });
    const withIt = (await progress()).json;
    expect(withIt.consent.ok).toBe(true);
    expect(withIt.tests.length).toBeGreaterThan(0);
    // Eighteen today: their own consent is enough.
    await setConsent(ids.tessa, { dateOfBirth: years(18), guardianConsentOn: null });
    expect((await progress()).json.consent).toEqual({ ok: true, minor: false, missing: [] });
    await setConsent(ids.tessa, { dateOfBirth: "1995-02-08" });
  });
});

describe("GET /api/me/export", () => {
  it("downloads every result held about the athlete, drafts included with their status, as JSON", async () => {
    await signInAs("athlete@example.com");
    const { status, json, headers } = await exportAs("json");
    expect(status).toBe(200);
    expect(headers.get("content-disposition")).toMatch(
      /^attachment; filename="my-changewise-data-\d{4}-\d{2}-\d{2}\.json"$/,
    );
    const stored = await env.db.select({ id: results.id }).from(results).where(eq(results.athleteId, ids.tessa));
    expect(json.results).toHaveLength(stored.length);
    const statuses = new Set(json.results.map((r: { sessionStatus: string }) => r.sessionStatus));
    expect(statuses).toEqual(new Set(["draft", "published"]));
    expect(json.profile).toMatchObject({
      name: "Tessa Lindqvist",
      email: "athlete@example.com",
      squads: ["Senior Women"],
      consentRecordedOn: "2026-08-20",
    });
    const text = JSON.stringify(json);
    const others = await env.db.select({ name: athletes.name }).from(athletes).where(ne(athletes.id, ids.tessa));
    for (const { name } of others) expect(text).not.toContain(name);
  });

  it("writes CSV through the formula-safe writer: a cell that starts like a formula is neutralised", async () => {
    await env.db.update(athletes).set({ position: '=HYPERLINK("http://x")' }).where(eq(athletes.id, ids.tessa));
    await env.db
      .update(results)
      .set({ note: "@SUM(A1), said the gate" })
      .where(and(eq(results.athleteId, ids.tessa), eq(results.sessionId, ids.baseline)));
    await signInAs("athlete@example.com");
    const { status, json: text, headers } = await exportAs("csv");
    expect(status).toBe(200);
    expect(headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(headers.get("content-disposition")).toMatch(/^attachment; filename="my-changewise-data-.*\.csv"$/);
    expect(text).toContain(`position,"'=HYPERLINK(""http://x"")"`);
    expect(text).toContain(`"'@SUM(A1), said the gate"`);
    expect(text).not.toMatch(/(^|,)[=@]/m);
    expect(text).toContain("date,phase,session status,squad,test,unit,direction,value,flag,trial 1");
    const lines = text.split("\r\n");
    const stored = await env.db.select({ id: results.id }).from(results).where(eq(results.athleteId, ids.tessa));
    const header = lines.findIndex((l: string) => l.startsWith("date,phase"));
    expect(lines.slice(header + 1).filter(Boolean)).toHaveLength(stored.length);
    const others = await env.db.select({ name: athletes.name }).from(athletes).where(ne(athletes.id, ids.tessa));
    for (const { name } of others) expect(text).not.toContain(name);
  });

  it("refuses a format it does not write", async () => {
    await signInAs("athlete@example.com");
    expect((await exportAs("xml")).status).toBe(422);
    expect((await call(exportRoute.GET, { url: "http://test.local/api/me/export" })).status).toBe(422);
  });
});
