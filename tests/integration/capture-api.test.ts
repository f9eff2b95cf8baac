import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, auditEvents, results, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const testsRoute = await import("@/app/api/tests/route");
const testRoute = await import("@/app/api/tests/[testId]/route");
const squadsRoute = await import("@/app/api/squads/route");
const squadRoute = await import("@/app/api/squads/[squadId]/route");
const squadAthletesRoute = await import("@/app/api/squads/[squadId]/athletes/route");
const athleteRoute = await import("@/app/api/athletes/[athleteId]/route");
const sessionsRoute = await import("@/app/api/sessions/route");
const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");
const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
const undoRoute = await import("@/app/api/sessions/[sessionId]/undo/route");
const auditRoute = await import("@/app/api/sessions/[sessionId]/audit/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = {
  senior: 0,
  academy: 0,
  cmj: 0,
  sprint10: 0,
  squat: 0,
  academyAthlete: 0,
  seniorAthlete: 0,
  academyPublished: 0,
};

beforeAll(async () => {
  env = await setupTestDatabase();
  const sq = await env.db.select({ id: squads.id, name: squads.name }).from(squads);
  ids.senior = sq.find((s) => s.name === "Senior Women")!.id;
  ids.academy = sq.find((s) => s.name === "Academy U18")!.id;
  const t = await env.db.select({ id: tests.id, name: tests.name }).from(tests);
  ids.cmj = t.find((x) => x.name === "Countermovement jump")!.id;
  ids.sprint10 = t.find((x) => x.name === "10 m sprint")!.id;
  ids.squat = t.find((x) => x.name === "Back squat 1RM")!.id;
  const a = await env.db.select({ id: athletes.id, name: athletes.name }).from(athletes);
  ids.academyAthlete = a.find((x) => x.name === "Theo Varga")!.id;
  ids.seniorAthlete = a.find((x) => x.name === "Maren Oduya")!.id;
  ids.academyPublished = (
    await env.db
      .select({ id: testingSessions.id })
      .from(testingSessions)
      .where(and(eq(testingSessions.squadId, ids.academy), eq(testingSessions.status, "published")))
  )[0].id;
});
afterAll(() => env.cleanup());

const p = <K extends string>(name: K, value: number) => ({ [name]: String(value) }) as Record<K, string>;

describe("Test library", () => {
  it("owner and scientist create and edit; a coach only reads", async () => {
    await signInAs("coach@example.com");
    expect((await call(testsRoute.GET)).json.tests.length).toBe(5);
    expect(
      (await call(testsRoute.POST, { method: "POST", body: { name: "Broad jump", unit: "cm", direction: "higher" } }))
        .status,
    ).toBe(403);

    await signInAs("scientist@example.com");
    const created = await call(testsRoute.POST, {
      method: "POST",
      body: { name: "Broad jump", unit: "cm", decimals: 0, direction: "higher", plausibleMin: 100, plausibleMax: 350 },
    });
    expect(created.status).toBe(201);
    expect(created.json.test).toMatchObject({
      name: "Broad jump",
      trialRule: "best",
      swcMethod: "sd-factor",
      swcValue: 0.2,
      version: 1,
    });

    const duplicate = await call(testsRoute.POST, {
      method: "POST",
      body: { name: "Broad jump", unit: "cm", direction: "higher" },
    });
    expect(duplicate.status).toBe(409);

    const id = created.json.test.id;
    const edited = await call(testRoute.PATCH, {
      method: "PATCH",
      params: p("testId", id),
      body: { version: 1, typicalError: 4.1, typicalErrorDf: 19, typicalErrorSource: "Club pilot" },
    });
    expect(edited.status).toBe(200);
    expect(edited.json.test).toMatchObject({ typicalError: 4.1, version: 2 });
    const stale = await call(testRoute.PATCH, {
      method: "PATCH",
      params: p("testId", id),
      body: { version: 1, decimals: 1 },
    });
    expect(stale.status).toBe(409);
    expect(stale.json.error.code).toBe("conflict");

    // Unused: really deleted. Used: archived, never deleted.
    expect((await call(testRoute.DELETE, { method: "DELETE", params: p("testId", id) })).json).toEqual({
      deleted: true,
    });
    expect((await call(testRoute.DELETE, { method: "DELETE", params: p("testId", ids.squat) })).json).toEqual({
      archived: true,
    });
    const [squat] = await env.db.select({ archived: tests.archived }).from(tests).where(eq(tests.id, ids.squat));
    expect(squat.archived).toBe(true);
  });

  it("refuses bad input with field messages, never a 500", async () => {
    await signInAs("owner@example.com");
    const bad = await call(testsRoute.POST, {
      method: "POST",
      body: { name: "", unit: "cm", direction: "sideways", decimals: 9 },
    });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["name", "direction", "decimals"]));
    const range = await call(testsRoute.POST, {
      method: "POST",
      body: { name: "X", unit: "cm", direction: "higher", plausibleMin: 10, plausibleMax: 5 },
    });
    expect(range.status).toBe(422);
    const notJson = await call(testsRoute.POST, {
      method: "POST",
      body: "{oops",
      headers: { "content-type": "application/json" },
    });
    expect(notJson.status).toBe(400);
    const wrongType = await call(testsRoute.POST, { method: "POST", body: "name=x" });
    expect(wrongType.status).toBe(415);
    const huge = await call(testsRoute.POST, {
      method: "POST",
      body: JSON.stringify({ name: "x".repeat(3 * 1024 * 1024) }),
      headers: { "content-type": "application/json" },
    });
    expect(huge.status).toBe(413);
    expect(huge.json.error.code).toBe("payload_too_large");
  });
});

describe("Roster", () => {
  it("only the owner creates squads; coaches add athletes to their own squad only", async () => {
    await signInAs("scientist@example.com");
    expect((await call(squadsRoute.POST, { method: "POST", body: { name: "Masters" } })).status).toBe(403);
    await signInAs("owner@example.com");
    const masters = await call(squadsRoute.POST, { method: "POST", body: { name: "Masters", sport: "Athletics" } });
    expect(masters.status).toBe(201);
    expect((await call(squadsRoute.POST, { method: "POST", body: { name: "Masters" } })).status).toBe(409);

    await signInAs("coach@example.com");
    const added = await call(squadAthletesRoute.POST, {
      method: "POST",
      params: p("squadId", ids.academy),
      body: { name: "Noah Ferrante", position: "MF", externalId: "NHA099" },
    });
    expect(added.status).toBe(201);
    expect(
      (await call(squadAthletesRoute.GET, { params: p("squadId", ids.academy) })).json.athletes.map((a: any) => a.name),
    ).toContain("Noah Ferrante");
    expect(
      (
        await call(squadAthletesRoute.POST, {
          method: "POST",
          params: p("squadId", ids.senior),
          body: { name: "Sneaky" },
        })
      ).status,
    ).toBe(404);
    expect((await call(squadRoute.GET, { params: p("squadId", ids.senior) })).status).toBe(404);
    expect(
      (
        await call(athleteRoute.PATCH, {
          method: "PATCH",
          params: p("athleteId", ids.seniorAthlete),
          body: { name: "Renamed" },
        })
      ).status,
    ).toBe(404);
    const dupExternal = await call(squadAthletesRoute.POST, {
      method: "POST",
      params: p("squadId", ids.academy),
      body: { name: "Another", externalId: "NHA099" },
    });
    expect(dupExternal.status).toBe(409);
  });

  it("the owner assigns coaches, archives athletes and moves them between squads", async () => {
    await signInAs("owner@example.com");
    const coachId = (await import("../helpers/db")).userIdOf;
    const coach = await coachId("coach@example.com");
    const assigned = await call(squadRoute.PATCH, {
      method: "PATCH",
      params: p("squadId", ids.senior),
      body: { coachUserIds: [coach] },
    });
    expect(assigned.status).toBe(200);
    expect(
      (await call(squadRoute.GET, { params: p("squadId", ids.senior) })).json.squad.coaches.map((c: any) => c.email),
    ).toEqual(["coach@example.com"]);
    const notACoach = await call(squadRoute.PATCH, {
      method: "PATCH",
      params: p("squadId", ids.senior),
      body: { coachUserIds: [await coachId("athlete@example.com")] },
    });
    expect(notACoach.status).toBe(422);
    await call(squadRoute.PATCH, { method: "PATCH", params: p("squadId", ids.senior), body: { coachUserIds: [] } });

    const moved = await call(athleteRoute.PATCH, {
      method: "PATCH",
      params: p("athleteId", ids.seniorAthlete),
      body: { squadIds: [ids.academy] },
    });
    expect(moved.status).toBe(200);
    expect(moved.json.athlete.squadIds).toEqual([ids.academy]);
    await call(athleteRoute.PATCH, {
      method: "PATCH",
      params: p("athleteId", ids.seniorAthlete),
      body: { squadIds: [ids.senior], archived: true },
    });
    const active = (await call(squadAthletesRoute.GET, { params: p("squadId", ids.senior) })).json.athletes.map(
      (a: any) => a.id,
    );
    expect(active).not.toContain(ids.seniorAthlete);
    const all = (
      await call(squadAthletesRoute.GET, {
        url: "http://test.local/api?archived=include",
        params: p("squadId", ids.senior),
      })
    ).json.athletes.map((a: any) => a.id);
    expect(all).toContain(ids.seniorAthlete);
    await call(athleteRoute.PATCH, {
      method: "PATCH",
      params: p("athleteId", ids.seniorAthlete),
      body: { archived: false },
    });
  });
});

describe("Testing sessions and the Session sheet API", () => {
  let sessionId = 0;

  it("a coach creates a session for their squad, not for another", async () => {
    await signInAs("coach@example.com");
    const bad = await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId: ids.academy, date: "2026-02-30", phase: "retest", testIds: [] },
    });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["date", "testIds"]));
    expect(
      (
        await call(sessionsRoute.POST, {
          method: "POST",
          body: { squadId: ids.senior, date: "2026-12-01", phase: "retest", testIds: [ids.cmj] },
        })
      ).status,
    ).toBe(404);
    const created = await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId: ids.academy, date: "2026-12-01", phase: "in-season", testIds: [ids.cmj, ids.sprint10] },
    });
    expect(created.status).toBe(201);
    sessionId = created.json.session.id;
    const sheet = await call(sessionRoute.GET, { params: p("sessionId", sessionId) });
    expect(sheet.json.tests.map((t: any) => t.name)).toEqual(["Countermovement jump", "10 m sprint"]);
    expect(sheet.json.athletes.length).toBe(13);
    expect(sheet.json).toMatchObject({ canEdit: true, canPublish: false, results: [] });
    const listed = (await call(sessionsRoute.GET, { url: `http://test.local/api?squadId=${ids.academy}` })).json
      .sessions;
    expect(listed[0]).toMatchObject({ id: sessionId, testIds: [ids.cmj, ids.sprint10], resultCount: 0 });
  });

  it("saves cells with versions, reduces trials by the test's rule, and refuses stale writes", async () => {
    await signInAs("coach@example.com");
    const first = await call(resultsRoute.PUT, {
      method: "PUT",
      params: p("sessionId", sessionId),
      body: {
        results: [
          { athleteId: ids.academyAthlete, testId: ids.cmj, trials: [31.2, 32.8, null], flag: null, version: null },
          { athleteId: ids.academyAthlete, testId: ids.sprint10, trials: [1.92, 1.88, 1.9], flag: null, version: null },
        ],
      },
    });
    expect(first.status).toBe(200);
    const byTest = Object.fromEntries(first.json.results.map((r: any) => [r.testId, r]));
    expect(byTest[ids.cmj]).toMatchObject({
      value: 32.8,
      version: 1,
      trials: [31.2, 32.8],
      updatedByName: "Gus Adebayo",
    });
    expect(byTest[ids.sprint10].value).toBe(1.88); // lower is better: the best sprint is the fastest

    await signInAs("scientist@example.com");
    const theirs = await call(resultsRoute.PUT, {
      method: "PUT",
      params: p("sessionId", sessionId),
      body: {
        results: [{ athleteId: ids.academyAthlete, testId: ids.cmj, trials: [31.2, 33.1], flag: null, version: 1 }],
      },
    });
    expect(theirs.json.results[0].version).toBe(2);

    await signInAs("coach@example.com");
    const before = (await env.db.select({ n: count() }).from(auditEvents))[0].n;
    const stale = await call(resultsRoute.PUT, {
      method: "PUT",
      params: p("sessionId", sessionId),
      body: {
        results: [
          { athleteId: ids.academyAthlete, testId: ids.sprint10, trials: [1.5], flag: null, version: 1 },
          { athleteId: ids.academyAthlete, testId: ids.cmj, trials: [40], flag: null, version: 1 },
        ],
      },
    });
    expect(stale.status).toBe(409);
    expect(stale.json.error.message).toContain("Dr Tomás Everly");
    expect(stale.json.error.details.conflicts[0]).toMatchObject({
      testId: ids.cmj,
      current: { version: 2, trials: [31.2, 33.1], updatedByName: "Dr Tomás Everly" },
    });
    // All or nothing: the non-conflicting sprint cell was not written either.
    const [sprint] = await env.db
      .select({ trials: results.trials, version: results.version })
      .from(results)
      .where(and(eq(results.sessionId, sessionId), eq(results.testId, ids.sprint10)));
    expect(sprint).toEqual({ trials: [1.92, 1.88, 1.9], version: 1 });
    expect((await env.db.select({ n: count() }).from(auditEvents))[0].n).toBe(before);
  });

  it("rejects non-numbers and too many trials with 422, athletes not on the sheet with 404", async () => {
    await signInAs("coach@example.com");
    const put = (results: unknown[]) =>
      call(resultsRoute.PUT, { method: "PUT", params: p("sessionId", sessionId), body: { results } });
    const word = await put([
      { athleteId: ids.academyAthlete, testId: ids.cmj, trials: ["abc"], flag: null, version: 2 },
    ]);
    expect(word.status).toBe(422);
    expect(Object.keys(word.json.error.fields)[0]).toBe("results.0.trials.0");
    const many = await put([
      { athleteId: ids.academyAthlete, testId: ids.cmj, trials: [1, 2, 3, 4], flag: null, version: 2 },
    ]);
    expect(many.status).toBe(422);
    expect(many.json.error.rows[0]).toMatchObject({ row: 0, column: "trials" });
    const outsider = await put([
      { athleteId: ids.seniorAthlete, testId: ids.cmj, trials: [30], flag: null, version: null },
    ]);
    expect(outsider.status).toBe(404);
    expect(outsider.json.error.rows[0]).toMatchObject({ row: 0, column: "athleteId" });
    const notInBattery = await put([
      { athleteId: ids.academyAthlete, testId: ids.squat, trials: [100], flag: null, version: null },
    ]);
    expect(notInBattery.status).toBe(422);
  });

  it("undoes the caller's last change and lists every change in the audit", async () => {
    await signInAs("coach@example.com");
    await call(resultsRoute.PUT, {
      method: "PUT",
      params: p("sessionId", sessionId),
      body: {
        results: [
          {
            athleteId: ids.academyAthlete,
            testId: ids.sprint10,
            trials: [1.95],
            flag: "invalid",
            note: "Slipped at the start",
            version: 1,
          },
        ],
      },
    });
    const undone = await call(undoRoute.POST, { method: "POST", params: p("sessionId", sessionId) });
    expect(undone.status).toBe(200);
    expect(undone.json.undone.result).toMatchObject({ trials: [1.92, 1.88, 1.9], flag: null, value: 1.88, version: 3 });
    const audit = (await call(auditRoute.GET, { params: p("sessionId", sessionId) })).json.events;
    expect(audit[0]).toMatchObject({
      action: "result.undo",
      actorName: "Gus Adebayo",
      athleteName: "Theo Varga",
      testName: "10 m sprint",
    });
    expect(audit.find((e: any) => e.action === "result.update" && e.actorName === "Dr Tomás Everly")).toMatchObject({
      before: { trials: [31.2, 32.8] },
      after: { trials: [31.2, 33.1] },
    });

    // Undo walks back: the coach's first sprint entry goes, so the cell is empty again.
    const second = await call(undoRoute.POST, { method: "POST", params: p("sessionId", sessionId) });
    expect(second.status).toBe(200);
    expect(second.json.undone).toMatchObject({ testId: ids.sprint10, result: null });
    // The coach's cmj entry was changed by the scientist afterwards, so it is not theirs to undo.
    const third = await call(undoRoute.POST, { method: "POST", params: p("sessionId", sessionId) });
    expect(third.status).toBe(409);
    expect(third.json.error.message).toContain("Dr Tomás Everly");
  });

  it("published sessions are read-only for coaches; publishing is for scientists and owners", async () => {
    await signInAs("coach@example.com");
    const sheet = await call(sessionRoute.GET, { params: p("sessionId", ids.academyPublished) });
    expect(sheet.json.canEdit).toBe(false);
    const write = await call(resultsRoute.PUT, {
      method: "PUT",
      params: p("sessionId", ids.academyPublished),
      body: { results: [{ athleteId: ids.academyAthlete, testId: ids.cmj, trials: [30], flag: null, version: 1 }] },
    });
    expect(write.status).toBe(403);
    const publish = await call(sessionRoute.PATCH, {
      method: "PATCH",
      params: p("sessionId", sessionId),
      body: { version: 1, status: "published" },
    });
    expect(publish.status).toBe(403);

    await signInAs("scientist@example.com");
    const ok = await call(sessionRoute.PATCH, {
      method: "PATCH",
      params: p("sessionId", sessionId),
      body: { version: 1, status: "published" },
    });
    expect(ok.status).toBe(200);
    const again = await call(sessionRoute.PATCH, {
      method: "PATCH",
      params: p("sessionId", sessionId),
      body: { version: 1, notes: "late" },
    });
    expect(again.status).toBe(409);
  });

  it("another organisation reaches none of it", async () => {
    await signInAs("owner@other.example.com");
    expect((await call(sessionRoute.GET, { params: p("sessionId", sessionId) })).status).toBe(404);
    expect(
      (
        await call(resultsRoute.PUT, {
          method: "PUT",
          params: p("sessionId", sessionId),
          body: {
            results: [{ athleteId: ids.academyAthlete, testId: ids.cmj, trials: [1], flag: null, version: null }],
          },
        })
      ).status,
    ).toBe(404);
    expect(
      (await call(testRoute.PATCH, { method: "PATCH", params: p("testId", ids.cmj), body: { version: 1, name: "x" } }))
        .status,
    ).toBe(404);
    expect((await call(squadAthletesRoute.GET, { params: p("squadId", ids.academy) })).status).toBe(404);
    expect(
      (
        await call(athleteRoute.PATCH, {
          method: "PATCH",
          params: p("athleteId", ids.academyAthlete),
          body: { name: "x" },
        })
      ).status,
    ).toBe(404);
  });
});
