import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const { guard, MANAGERS, STAFF } = await import("@/lib/auth/guard");
const { ApiError } = await import("@/lib/errors");
const { endAllSessions } = await import("@/lib/data/actors");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = {
  senior: 0,
  academy: 0,
  rowing: 0,
  seniorAthlete: 0,
  academyAthlete: 0,
  tessa: 0,
  rower: 0,
  seniorPublished: 0,
  seniorDraft: 0,
  rowingSession: 0,
  clubTest: 0,
  otherTest: 0,
};

async function statusOf(promise: Promise<unknown>): Promise<number> {
  try {
    await promise;
    return 200;
  } catch (error) {
    if (error instanceof ApiError) return error.status;
    throw error;
  }
}

beforeAll(async () => {
  env = await setupTestDatabase();
  const sq = await env.db.select({ id: squads.id, name: squads.name }).from(squads);
  ids.senior = sq.find((s) => s.name === "Senior Women")!.id;
  ids.academy = sq.find((s) => s.name === "Academy U18")!.id;
  ids.rowing = sq.find((s) => s.name === "Junior Sculling")!.id;
  const ath = await env.db.select({ id: athletes.id, name: athletes.name }).from(athletes);
  ids.tessa = ath.find((a) => a.name === "Tessa Lindqvist")!.id;
  ids.seniorAthlete = ath.find((a) => a.name === "Maren Oduya")!.id;
  ids.academyAthlete = ath.find((a) => a.name === "Theo Varga")!.id;
  ids.rower = ath.find((a) => a.name === "Wren Abernathy")!.id;
  const sessions = await env.db
    .select({
      id: testingSessions.id,
      squadId: testingSessions.squadId,
      status: testingSessions.status,
      phase: testingSessions.phase,
    })
    .from(testingSessions);
  ids.seniorPublished = sessions.find((s) => s.squadId === ids.senior && s.status === "published")!.id;
  ids.seniorDraft = sessions.find((s) => s.squadId === ids.senior && s.phase === "post-block")!.id;
  ids.rowingSession = sessions.find((s) => s.squadId === ids.rowing)!.id;
  const t = await env.db.select({ id: tests.id, name: tests.name }).from(tests);
  ids.clubTest = t.find((x) => x.name === "Countermovement jump")!.id;
  ids.otherTest = t.find((x) => x.name === "2000 m ergometer")!.id;
});
afterAll(() => env.cleanup());

describe("guard: who is asking", () => {
  it("answers 401 to a signed-out caller", async () => {
    await signInAs(null);
    expect(await statusOf(guard())).toBe(401);
  });

  it("answers 401 to a token issued before the user's sessions were ended", async () => {
    await signInAs("coach@example.com");
    expect(await statusOf(guard())).toBe(200);
    const actor = await guard();
    await endAllSessions(actor.userId);
    expect(await statusOf(guard())).toBe(401);
    await signInAs("coach@example.com");
    expect(await statusOf(guard())).toBe(200);
  });

  it("resolves organisation and role for every demo account", async () => {
    const expected = {
      "owner@example.com": "owner",
      "scientist@example.com": "scientist",
      "coach@example.com": "coach",
      "athlete@example.com": "athlete",
      "owner@other.example.com": "owner",
    } as const;
    for (const [email, role] of Object.entries(expected)) {
      await signInAs(email);
      const actor = await guard();
      expect(actor.role).toBe(role);
      expect(actor.email).toBe(email);
    }
  });

  it("refuses roles that are not allowed with 403", async () => {
    await signInAs("coach@example.com");
    expect(await statusOf(guard({ roles: MANAGERS }))).toBe(403);
    await signInAs("athlete@example.com");
    expect(await statusOf(guard({ roles: STAFF }))).toBe(403);
  });
});

describe("guard: reach", () => {
  it("owner and scientist reach every record of their organisation and none of the other", async () => {
    for (const email of ["owner@example.com", "scientist@example.com"]) {
      await signInAs(email);
      for (const options of [
        { squadId: ids.senior },
        { squadId: ids.academy },
        { athleteId: ids.seniorAthlete },
        { sessionId: ids.seniorDraft },
        { testId: ids.clubTest },
      ]) {
        expect(await statusOf(guard(options))).toBe(200);
      }
      for (const options of [
        { squadId: ids.rowing },
        { athleteId: ids.rower },
        { sessionId: ids.rowingSession },
        { testId: ids.otherTest },
      ]) {
        expect(await statusOf(guard(options))).toBe(404);
      }
    }
  });

  it("a coach reaches only the squads they coach, and those squads' athletes and sessions", async () => {
    await signInAs("coach@example.com");
    expect(await statusOf(guard({ squadId: ids.academy }))).toBe(200);
    expect(await statusOf(guard({ athleteId: ids.academyAthlete }))).toBe(200);
    expect(await statusOf(guard({ squadId: ids.senior }))).toBe(404);
    expect(await statusOf(guard({ athleteId: ids.seniorAthlete }))).toBe(404);
    expect(await statusOf(guard({ sessionId: ids.seniorPublished }))).toBe(404);
    expect(await statusOf(guard({ testId: ids.clubTest }))).toBe(200);
  });

  it("an athlete reaches only themself and their squad's published sessions", async () => {
    await signInAs("athlete@example.com");
    expect(await statusOf(guard({ athleteId: ids.tessa }))).toBe(200);
    expect(await statusOf(guard({ athleteId: ids.seniorAthlete }))).toBe(404);
    expect(await statusOf(guard({ sessionId: ids.seniorPublished }))).toBe(200);
    expect(await statusOf(guard({ sessionId: ids.seniorDraft }))).toBe(404);
    expect(await statusOf(guard({ squadId: ids.senior }))).toBe(404);
  });

  it("the other organisation's owner gets 404 for every athlete of the demo club", async () => {
    await signInAs("owner@other.example.com");
    const clubAthletes = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.organizationId, 1));
    expect(clubAthletes.length).toBe(30);
    for (const { id } of clubAthletes) expect(await statusOf(guard({ athleteId: id }))).toBe(404);
    expect(await statusOf(guard({ athleteId: ids.rower }))).toBe(200);
  });
});
