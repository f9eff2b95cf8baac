import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const me = await import("@/app/api/me/route");
const squadsRoute = await import("@/app/api/squads/route");
const athletesRoute = await import("@/app/api/athletes/route");
const resultsRoute = await import("@/app/api/athletes/[athleteId]/results/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let clubAthleteIds: number[] = [];
let tessaId = 0;

beforeAll(async () => {
  env = await setupTestDatabase();
  clubAthleteIds = (await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.organizationId, 1))).map(
    (a) => a.id,
  );
  tessaId = (await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Tessa Lindqvist")))[0].id;
});
afterAll(() => env.cleanup());

const expectErrorShape = (json: any, code: string) => {
  expect(json).toEqual({ error: expect.objectContaining({ code, message: expect.any(String) }) });
};

describe("anonymous callers", () => {
  it("get 401 with the error shape on every route", async () => {
    await signInAs(null);
    const answers = [
      await call(me.GET),
      await call(squadsRoute.GET),
      await call(athletesRoute.GET),
      await call(resultsRoute.GET, { params: { athleteId: String(tessaId) } }),
    ];
    for (const answer of answers) {
      expect(answer.status).toBe(401);
      expectErrorShape(answer.json, "unauthenticated");
    }
  });
});

describe("GET /api/me", () => {
  it("gives user, organisation and role", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await call(me.GET);
    expect(status).toBe(200);
    expect(json).toMatchObject({
      user: { email: "scientist@example.com", name: "Dr Tomás Everly" },
      organization: { name: "Northfield Harriers & Rovers Performance Unit" },
      role: "scientist",
    });
    expect(JSON.stringify(json)).not.toContain("password");
  });
});

describe("GET /api/athletes scoping", () => {
  it("owner sees the organisation; coach sees a strict subset; athlete sees only themself", async () => {
    await signInAs("owner@example.com");
    const owner = (await call(athletesRoute.GET)).json.athletes.map((a: any) => a.id).sort();
    expect(owner).toEqual([...clubAthleteIds].sort());

    await signInAs("coach@example.com");
    const coach = (await call(athletesRoute.GET)).json.athletes.map((a: any) => a.id);
    expect(coach.length).toBe(12);
    expect(coach.every((id: number) => owner.includes(id))).toBe(true);

    await signInAs("athlete@example.com");
    const self = await call(athletesRoute.GET);
    expect(self.json.athletes).toHaveLength(1);
    expect(self.json.athletes[0]).toMatchObject({ id: tessaId, name: "Tessa Lindqvist" });
  });

  it("the other organisation sees only its own six rowers", async () => {
    await signInAs("owner@other.example.com");
    const list = (await call(athletesRoute.GET)).json.athletes;
    expect(list).toHaveLength(6);
    expect(list.some((a: any) => clubAthleteIds.includes(a.id))).toBe(false);
  });
});

describe("GET /api/athletes/[athleteId]/results", () => {
  it("an athlete reads their own published results and nothing else", async () => {
    await signInAs("athlete@example.com");
    const own = await call(resultsRoute.GET, { params: { athleteId: String(tessaId) } });
    expect(own.status).toBe(200);
    expect(own.json.results.length).toBeGreaterThan(0);
    expect(own.json.results.every((r: any) => r.status === "published")).toBe(true);

    const other = clubAthleteIds.find((id) => id !== tessaId)!;
    const denied = await call(resultsRoute.GET, { params: { athleteId: String(other) } });
    expect(denied.status).toBe(404);
    expectErrorShape(denied.json, "not_found");
  });

  it("staff see drafts as well", async () => {
    await signInAs("scientist@example.com");
    const all = await call(resultsRoute.GET, { params: { athleteId: String(tessaId) } });
    expect(all.json.results.some((r: any) => r.status === "draft")).toBe(true);
  });

  it("the other organisation's owner gets 404 for every athlete of the demo club", async () => {
    await signInAs("owner@other.example.com");
    for (const id of clubAthleteIds) {
      const { status, json } = await call(resultsRoute.GET, { params: { athleteId: String(id) } });
      expect(status).toBe(404);
      expectErrorShape(json, "not_found");
    }
  });

  it("a malformed id is a 404, never a 500", async () => {
    await signInAs("owner@example.com");
    for (const bad of ["abc", "-1", "0", "1.5", "9999999999999999999", "%00"]) {
      expect((await call(resultsRoute.GET, { params: { athleteId: bad } })).status).toBe(404);
    }
  });
});

describe("GET /api/squads", () => {
  it("lists squads with athlete counts and the latest session, scoped by role", async () => {
    await signInAs("owner@example.com");
    const owner = (await call(squadsRoute.GET)).json.squads;
    expect(owner.map((s: any) => [s.name, s.athleteCount])).toEqual([
      ["Academy U18", 12],
      ["Senior Women", 18],
    ]);
    expect(owner.find((s: any) => s.name === "Senior Women").latestSession).toMatchObject({
      date: "2026-11-02",
      phase: "post-block",
    });

    await signInAs("coach@example.com");
    expect((await call(squadsRoute.GET)).json.squads.map((s: any) => s.name)).toEqual(["Academy U18"]);

    await signInAs("athlete@example.com");
    const athlete = await call(squadsRoute.GET);
    expect(athlete.status).toBe(403);
    expectErrorShape(athlete.json, "forbidden");
  });
});

describe("cross-site requests", () => {
  it("refuses a change whose Origin is another site, and accepts our own", async () => {
    await signInAs("owner@example.com");
    const squadsApi = await import("@/app/api/squads/route");
    const foreign = await call(squadsApi.POST, {
      method: "POST",
      url: "http://changewise.test/api/squads",
      body: { name: "Phished" },
      headers: { origin: "https://evil.example", host: "changewise.test" },
    });
    expect(foreign.status).toBe(403);
    const opaque = await call(squadsApi.POST, {
      method: "POST",
      url: "http://changewise.test/api/squads",
      body: { name: "Sandboxed" },
      headers: { origin: "null", host: "changewise.test" },
    });
    expect(opaque.status).toBe(403);
    const own = await call(squadsApi.POST, {
      method: "POST",
      url: "http://changewise.test/api/squads",
      body: { name: "Track Masters" },
      headers: { origin: "http://changewise.test", host: "changewise.test" },
    });
    expect(own.status).toBe(201);
  });
});
