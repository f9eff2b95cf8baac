/**
 * The typo guard through the results API and the import: a 10 m sprint of 17.60 s (a slipped
 * decimal point for 1.76) is saved, and reported with its reasons; ordinary and flagged scores
 * are not. The athlete's last published score is read here straight from the tables.
 */
import { and, desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, results, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { uploadTo } from "../helpers/import-upload";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const sessionsRoute = await import("@/app/api/sessions/route");
const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { senior: 0, sprint10: 0, cmj: 0, maren: 0, session: 0 };
let lastPublished = 0;

beforeAll(async () => {
  env = await setupTestDatabase();
  ids.senior = (await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women")))[0].id;
  const t = await env.db.select({ id: tests.id, name: tests.name }).from(tests);
  ids.sprint10 = t.find((x) => x.name === "10 m sprint")!.id;
  ids.cmj = t.find((x) => x.name === "Countermovement jump")!.id;
  ids.maren = (await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Maren Oduya")))[0].id;
  const [row] = await env.db
    .select({ value: results.value })
    .from(results)
    .innerJoin(testingSessions, eq(testingSessions.id, results.sessionId))
    .where(
      and(eq(results.athleteId, ids.maren), eq(results.testId, ids.sprint10), eq(testingSessions.status, "published")),
    )
    .orderBy(desc(testingSessions.date));
  lastPublished = row.value!;
  await signInAs("scientist@example.com");
  const created = await call(sessionsRoute.POST, {
    method: "POST",
    body: { squadId: ids.senior, date: "2026-12-01", phase: "pre-block", testIds: [ids.sprint10, ids.cmj] },
  });
  ids.session = created.json.session.id;
});
afterAll(() => env.cleanup());

const put = (
  athleteId: number,
  testId: number,
  trials: (number | null)[],
  flag: string | null = null,
  version: number | null = null,
) =>
  call(resultsRoute.PUT, {
    method: "PUT",
    params: { sessionId: String(ids.session) },
    body: { results: [{ athleteId, testId, trials, flag, version }] },
  });

describe("PUT /api/sessions/[id]/results", () => {
  it("saves 17.60 s for a 10 m sprint and reports it as suspect, with every reason", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await put(ids.maren, ids.sprint10, [1.78, 17.6, 1.8]);
    expect(status).toBe(200);
    expect(json.results[0].trials).toEqual([1.78, 17.6, 1.8]);
    expect(json.suspects).toHaveLength(1);
    const [suspect] = json.suspects;
    expect(suspect).toMatchObject({ athleteId: ids.maren, testId: ids.sprint10, trial: 2, value: 17.6 });
    expect(suspect.reasons.map((r: { code: string }) => r.code)).toEqual([
      "outside-plausible",
      "far-from-history",
      "far-from-trials",
    ]);
    expect(suspect.reasons[0]).toEqual({ code: "outside-plausible", min: 1.5, max: 2.6 });
    expect(suspect.reasons[1]).toMatchObject({ previous: lastPublished });
    const [stored] = await env.db
      .select({ value: results.value })
      .from(results)
      .where(and(eq(results.sessionId, ids.session), eq(results.athleteId, ids.maren)));
    expect(stored.value).toBe(1.78); // best of the three: the suspect trial is saved, not used as best
  });

  it("reports nothing for a score close to the athlete's last, or for a flagged result", async () => {
    await signInAs("scientist@example.com");
    const near = Math.round((lastPublished + 0.01) * 100) / 100;
    const first = await put(ids.maren, ids.sprint10, [near], null, 1);
    expect(first.status).toBe(200);
    expect(first.json.suspects).toEqual([]);
    const flagged = await put(ids.maren, ids.sprint10, [17.6], "injured", 2);
    expect(flagged.status).toBe(200);
    expect(flagged.json.suspects).toEqual([]);
  });
});

describe("import", () => {
  it("lists suspect scores in the preview and again after the commit, and stores them", async () => {
    await signInAs("scientist@example.com");
    const csv = [
      "athlete,test,trial,value",
      "Maren Oduya,Countermovement jump,1,3.85",
      "Maren Oduya,Countermovement jump,2,38.5",
    ].join("\n");
    const preview = await uploadTo(importRoute.POST, ids.session, csv, { mode: "preview" });
    expect(preview.status).toBe(200);
    expect(preview.json.suspects).toHaveLength(1);
    expect(preview.json.suspects[0]).toMatchObject({ athleteId: ids.maren, testId: ids.cmj, trial: 1, value: 3.85 });
    expect(preview.json.suspects[0].reasons[0]).toMatchObject({ code: "outside-plausible", min: 15, max: 70 });
    const committed = await uploadTo(importRoute.POST, ids.session, csv, { mode: "commit" });
    expect(committed.status).toBe(200);
    expect(committed.json.suspects).toEqual(preview.json.suspects);
  });
});

describe("GET /api/sessions/[id]/publish-check", () => {
  it("lists the suspect scores and the missing cells by athlete, with names", async () => {
    await signInAs("scientist@example.com");
    const check = await import("@/app/api/sessions/[sessionId]/publish-check/route");
    const { status, json } = await call(check.GET, { params: { sessionId: String(ids.session) } });
    expect(status).toBe(200);
    expect(json.suspects).toEqual([
      expect.objectContaining({
        athleteName: "Maren Oduya",
        trial: 1,
        value: 3.85,
        test: expect.objectContaining({ name: "Countermovement jump", unit: "cm" }),
      }),
    ]);
    const squadSize = (await env.db.select({ id: athletes.id }).from(athletes)).length;
    expect(json.missing.length).toBeGreaterThan(10);
    expect(json.missing.length).toBeLessThan(squadSize);
    // Maren has a CMJ; her sprint is flagged "injured" — a flag is an answer, so nothing of hers is missing.
    expect(json.missing.find((a: { name: string }) => a.name === "Maren Oduya")).toBeUndefined();
    expect(json.missing[0].tests).toEqual(["10 m sprint", "Countermovement jump"]);
  });
});
