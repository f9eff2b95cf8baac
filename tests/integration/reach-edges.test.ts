/**
 * The edges of reach: what a coach may learn about athletes outside their squads, which athletes a
 * session's sheet covers once an athlete has moved squads, what an athlete learns from the Test
 * library, and which spellings of an id name a record.
 */

import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, results, squads, testingSessions } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const squadAthletesRoute = await import("@/app/api/squads/[squadId]/athletes/route");
const squadRoute = await import("@/app/api/squads/[squadId]/route");
const squadsRoute = await import("@/app/api/squads/route");
const athleteRoute = await import("@/app/api/athletes/[athleteId]/route");
const athleteResultsRoute = await import("@/app/api/athletes/[athleteId]/results/route");
const sessionsRoute = await import("@/app/api/sessions/route");
const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");
const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");
const testsRoute = await import("@/app/api/tests/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { senior: 0, academy: 0, academyPost: 0 };
let mover: { id: number; name: string; externalId: string };
let senior: { id: number; name: string; externalId: string };
let teammate: { id: number; name: string; externalId: string };

beforeAll(async () => {
  env = await setupTestDatabase();
  const sq = await env.db.select({ id: squads.id, name: squads.name }).from(squads);
  ids.senior = sq.find((s) => s.name === "Senior Women")!.id;
  ids.academy = sq.find((s) => s.name === "Academy U18")!.id;
  ids.academyPost = (
    await env.db
      .select({ id: testingSessions.id })
      .from(testingSessions)
      .where(and(eq(testingSessions.squadId, ids.academy), eq(testingSessions.phase, "post-block")))
  )[0].id;
  const all = await env.db
    .select({ id: athletes.id, name: athletes.name, externalId: athletes.externalId })
    .from(athletes);
  const withPostResult = new Set(
    (await env.db.select({ id: results.athleteId }).from(results).where(eq(results.sessionId, ids.academyPost))).map(
      (r) => r.id,
    ),
  );
  const academyAthletes = all.filter((a) => a.externalId?.startsWith("NHA") && withPostResult.has(a.id));
  mover = academyAthletes[0] as typeof mover;
  teammate = academyAthletes[1] as typeof teammate;
  senior = all.find((a) => a.externalId?.startsWith("NHW")) as typeof senior;
});
afterAll(() => env.cleanup());

const p = <K extends string>(name: K, value: number | string) => ({ [name]: String(value) }) as Record<K, string>;

describe("external ids outside a coach's reach", () => {
  it("a clash with an athlete the coach cannot reach names neither the athlete nor the id", async () => {
    await signInAs("coach@example.com");
    const add = await call(squadAthletesRoute.POST, {
      method: "POST",
      params: p("squadId", ids.academy),
      body: { name: "New Player", externalId: senior.externalId },
    });
    expect(add.status).toBe(409);
    const text = JSON.stringify(add.json);
    expect(text).not.toContain(senior.externalId);
    expect(text).not.toContain(senior.name);
    expect(add.json.error.details ?? null).toBeNull();

    const edit = await call(athleteRoute.PATCH, {
      method: "PATCH",
      params: p("athleteId", teammate.id),
      body: { externalId: senior.externalId },
    });
    expect(edit.status).toBe(409);
    expect(edit.json.error.message).toBe(add.json.error.message);
    expect(JSON.stringify(edit.json)).not.toContain(senior.name);
  });

  it("a clash inside reach names the athlete who holds the id, and the id stays unique", async () => {
    await signInAs("coach@example.com");
    const add = await call(squadAthletesRoute.POST, {
      method: "POST",
      params: p("squadId", ids.academy),
      body: { name: "New Player", externalId: teammate.externalId },
    });
    expect(add.status).toBe(409);
    expect(add.json.error.message).toContain(teammate.name);
    expect(add.json.error.details).toEqual({ athleteId: teammate.id });
    const holders = await env.db
      .select({ id: athletes.id })
      .from(athletes)
      .where(eq(athletes.externalId, teammate.externalId));
    expect(holders).toHaveLength(1);
  });
});

describe("an athlete who moved out of the coach's squad", () => {
  let newSessionId = 0;

  beforeAll(async () => {
    await signInAs("owner@example.com");
    expect(
      (
        await call(athleteRoute.PATCH, {
          method: "PATCH",
          params: p("athleteId", mover.id),
          body: { squadIds: [ids.senior] },
        })
      ).status,
    ).toBe(200);
    await signInAs("coach@example.com");
    const battery = (await call(sessionRoute.GET, { params: p("sessionId", ids.academyPost) })).json.tests.map(
      (t: { id: number }) => t.id,
    );
    const session = await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId: ids.academy, date: "2026-12-01", phase: "retest", testIds: battery },
    });
    expect(session.status).toBe(201);
    newSessionId = session.json.session.id;
  });

  it("is no longer an athlete record the coach reaches", async () => {
    await signInAs("coach@example.com");
    expect((await call(athleteRoute.GET, { params: p("athleteId", mover.id) })).status).toBe(404);
    expect((await call(athleteResultsRoute.GET, { params: p("athleteId", mover.id) })).status).toBe(404);
  });

  it("stays on the old session's sheet, where their results can still be corrected", async () => {
    await signInAs("coach@example.com");
    const sheet = await call(sessionRoute.GET, { params: p("sessionId", ids.academyPost) });
    expect(sheet.json.athletes.map((a: { id: number }) => a.id)).toContain(mover.id);
    const cell = sheet.json.results.find((r: { athleteId: number }) => r.athleteId === mover.id);
    const saved = await call(resultsRoute.PUT, {
      method: "PUT",
      params: p("sessionId", ids.academyPost),
      body: {
        results: [{ athleteId: mover.id, testId: cell.testId, trials: [40.5], flag: null, version: cell.version }],
      },
    });
    expect(saved.status).toBe(200);
  });

  it("is not on a new session's sheet, and a score for them there is refused as not found", async () => {
    await signInAs("coach@example.com");
    const sheet = await call(sessionRoute.GET, { params: p("sessionId", newSessionId) });
    expect(sheet.json.athletes.map((a: { id: number }) => a.id)).not.toContain(mover.id);
    const testId = sheet.json.tests[0].id;
    const write = (athleteId: number) =>
      call(resultsRoute.PUT, {
        method: "PUT",
        params: p("sessionId", newSessionId),
        body: { results: [{ athleteId, testId, trials: [40], flag: null, version: null }] },
      });
    const moved = await write(mover.id);
    expect(moved.status).toBe(404);
    // The same answer for an athlete of another squad and for one that does not exist.
    const other = await write(senior.id);
    const nobody = await write(999_999);
    expect([other.status, nobody.status]).toEqual([404, 404]);
    expect(other.json).toEqual(moved.json);
    expect(nobody.json).toEqual(moved.json);
  });

  it("the import takes the same athletes as the sheet", async () => {
    await signInAs("coach@example.com");
    const preview = async (sessionId: number) => {
      const form = new FormData();
      form.set(
        "file",
        new File([`athlete,test,trial,value\n${mover.externalId},Countermovement jump,1,41.2\n`], "scores.csv", {
          type: "text/csv",
        }),
      );
      return call(importRoute.POST, {
        url: `http://test.local/api/sessions/${sessionId}/import?mode=preview`,
        method: "POST",
        params: p("sessionId", sessionId),
        body: form,
      });
    };
    const old = await preview(ids.academyPost);
    expect(old.status).toBe(200);
    expect(old.json.unknownAthleteCount).toBe(0);
    const fresh = await preview(newSessionId);
    expect(fresh.json.unknownAthleteCount).toBe(1);
  });
});

describe("Test library counts", () => {
  it("an athlete sees the tests but no counts of other athletes' results; staff see the counts", async () => {
    await signInAs("athlete@example.com");
    const mine = await call(testsRoute.GET);
    expect(mine.status).toBe(200);
    expect(mine.json.tests.length).toBeGreaterThan(0);
    for (const test of mine.json.tests) expect(test).not.toHaveProperty("resultCount");
    await signInAs("coach@example.com");
    const staff = await call(testsRoute.GET);
    expect(staff.json.tests.some((t: { resultCount: number }) => t.resultCount > 0)).toBe(true);
  });
});

describe("ids in URLs", () => {
  const aliases = (id: number) => [
    `${id}.0`,
    `${id}e0`,
    `0x${id.toString(16)}`,
    ` ${id}`,
    `${id} `,
    `+${id}`,
    `0${id}`,
    `${id}.`,
    `${id}n`,
  ];

  it("only the canonical spelling of an id names a record", async () => {
    await signInAs("owner@example.com");
    expect((await call(squadRoute.GET, { params: p("squadId", ids.academy) })).status).toBe(200);
    for (const alias of aliases(ids.academy)) {
      expect((await call(squadRoute.GET, { params: { squadId: alias } })).status, alias).toBe(404);
      expect(
        (await call(sessionsRoute.GET, { url: `http://test.local/api/sessions?squadId=${encodeURIComponent(alias)}` }))
          .status,
        alias,
      ).toBe(404);
    }
    for (const alias of aliases(ids.academyPost))
      expect((await call(sessionRoute.GET, { params: { sessionId: alias } })).status, alias).toBe(404);
    const listed = await call(sessionsRoute.GET, { url: `http://test.local/api/sessions?squadId=${ids.academy}` });
    expect(listed.status).toBe(200);
    expect(listed.json.sessions.length).toBeGreaterThan(0);
  });

  it("ids in JSON bodies are whole positive numbers", async () => {
    await signInAs("owner@example.com");
    for (const squadId of [1.5, -1, 0, "1", 2 ** 53]) {
      const created = await call(sessionsRoute.POST, {
        method: "POST",
        body: { squadId, date: "2026-12-02", phase: "retest", testIds: [1] },
      });
      expect(created.status, String(squadId)).toBe(422);
    }
  });
});

describe("invisible text", () => {
  it("a name with nothing visible in it is refused; a formula-like name is stored as typed", async () => {
    await signInAs("owner@example.com");
    for (const name of ["\u0000", "\u200b", "\u202e", " \t\n ", "\u200b\u200d\u3164"]) {
      const created = await call(squadsRoute.POST, { method: "POST", body: { name } });
      expect(created.status, JSON.stringify(name)).toBe(422);
    }
    const spoof = await call(squadsRoute.POST, { method: "POST", body: { name: "\u202eU18 B\u200b" } });
    expect(spoof.status).toBe(201);
    expect(spoof.json.squad.name).toBe("U18 B");
    const formula = await call(squadsRoute.POST, {
      method: "POST",
      body: { name: '=HYPERLINK("http://x.example","y")' },
    });
    expect(formula.status).toBe(201);
    expect(formula.json.squad.name).toBe('=HYPERLINK("http://x.example","y")');
  });
});
