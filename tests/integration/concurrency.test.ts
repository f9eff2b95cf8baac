import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { and, eq } from "drizzle-orm";
import { athletes, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");
const sessionsRoute = await import("@/app/api/sessions/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
beforeAll(async () => {
  env = await setupTestDatabase();
});
afterAll(() => env.cleanup());

describe("concurrent writes in one server process", () => {
  it("many saves at once, with reads in between, all answer 200 or 409 — never a 500", async () => {
    await signInAs("scientist@example.com");
    const [squad] = await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women"));
    const [cmj] = await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "Countermovement jump"));
    const created = await call(sessionsRoute.POST, { method: "POST", body: { squadId: squad.id, date: "2026-12-02", phase: "retest", testIds: [cmj.id] } });
    const sessionId = String(created.json.session.id);
    const roster = await env.db
      .select({ id: athletes.id })
      .from(squadAthletes)
      .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
      .where(and(eq(squadAthletes.squadId, squad.id)));

    const writes = roster.map((a, i) =>
      call(resultsRoute.PUT, { method: "PUT", params: { sessionId }, body: { results: [{ athleteId: a.id, testId: cmj.id, trials: [30 + i / 10], flag: null, version: null }] } }),
    );
    // The same cell twice at once: one wins, the other must be told (409), not overwritten.
    const clash = [0, 1].map(() =>
      call(resultsRoute.PUT, { method: "PUT", params: { sessionId }, body: { results: [{ athleteId: roster[0].id, testId: cmj.id, trials: [99], flag: null, version: 1 }] } }),
    );
    const reads = [0, 1, 2].map(() => call(sessionRoute.GET, { params: { sessionId } }));
    const answers = await Promise.all([...writes, ...clash, ...reads]);

    expect(answers.slice(0, writes.length).every((a) => a.status === 200)).toBe(true);
    expect(answers.slice(writes.length, writes.length + 2).map((a) => a.status).sort()).toEqual([200, 409]);
    expect(answers.slice(-3).every((a) => a.status === 200)).toBe(true);

    const sheet = await call(sessionRoute.GET, { params: { sessionId } });
    expect(sheet.json.results).toHaveLength(roster.length);
    expect(sheet.json.results.find((r: any) => r.athleteId === roster[0].id)).toMatchObject({ trials: [99], version: 2 });
    const [row] = await env.db.select({ status: testingSessions.status }).from(testingSessions).where(eq(testingSessions.id, Number(sessionId)));
    expect(row.status).toBe("draft");
  });
});
