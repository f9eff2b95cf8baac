/**
 * Every API route × every role × a second organisation: nothing leaks.
 * Each route is called with ids of the demo club; the answer must be a refusal or
 * contain nothing the caller may not see (checked by looking for other athletes' names).
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { eq } from "drizzle-orm";
import { athletes, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

type Route = { name: string; module: string; method: string; params?: (ids: Ids) => Record<string, string>; body?: (ids: Ids) => unknown };
type Ids = { squad: number; athlete: number; session: number; test: number };

const ROUTES: Route[] = [
  { name: "GET /api/me", module: "@/app/api/me/route", method: "GET" },
  { name: "GET /api/squads", module: "@/app/api/squads/route", method: "GET" },
  { name: "POST /api/squads", module: "@/app/api/squads/route", method: "POST", body: () => ({ name: "Intruders" }) },
  { name: "GET /api/squads/[id]", module: "@/app/api/squads/[squadId]/route", method: "GET", params: (i) => ({ squadId: String(i.squad) }) },
  { name: "PATCH /api/squads/[id]", module: "@/app/api/squads/[squadId]/route", method: "PATCH", params: (i) => ({ squadId: String(i.squad) }), body: () => ({ name: "Renamed" }) },
  { name: "GET /api/squads/[id]/athletes", module: "@/app/api/squads/[squadId]/athletes/route", method: "GET", params: (i) => ({ squadId: String(i.squad) }) },
  { name: "POST /api/squads/[id]/athletes", module: "@/app/api/squads/[squadId]/athletes/route", method: "POST", params: (i) => ({ squadId: String(i.squad) }), body: () => ({ name: "Mole" }) },
  { name: "GET /api/athletes", module: "@/app/api/athletes/route", method: "GET" },
  { name: "PATCH /api/athletes/[id]", module: "@/app/api/athletes/[athleteId]/route", method: "PATCH", params: (i) => ({ athleteId: String(i.athlete) }), body: () => ({ name: "Renamed" }) },
  { name: "GET /api/athletes/[id]/results", module: "@/app/api/athletes/[athleteId]/results/route", method: "GET", params: (i) => ({ athleteId: String(i.athlete) }) },
  { name: "GET /api/coaches", module: "@/app/api/coaches/route", method: "GET" },
  { name: "GET /api/tests", module: "@/app/api/tests/route", method: "GET" },
  { name: "POST /api/tests", module: "@/app/api/tests/route", method: "POST", body: () => ({ name: "Sneaky", unit: "cm", direction: "higher" }) },
  { name: "GET /api/tests/[id]", module: "@/app/api/tests/[testId]/route", method: "GET", params: (i) => ({ testId: String(i.test) }) },
  { name: "PATCH /api/tests/[id]", module: "@/app/api/tests/[testId]/route", method: "PATCH", params: (i) => ({ testId: String(i.test) }), body: () => ({ version: 1, name: "Renamed" }) },
  { name: "DELETE /api/tests/[id]", module: "@/app/api/tests/[testId]/route", method: "DELETE", params: (i) => ({ testId: String(i.test) }) },
  { name: "GET /api/sessions", module: "@/app/api/sessions/route", method: "GET" },
  { name: "POST /api/sessions", module: "@/app/api/sessions/route", method: "POST", body: (i) => ({ squadId: i.squad, date: "2026-12-01", phase: "retest", testIds: [i.test] }) },
  { name: "GET /api/sessions/[id]", module: "@/app/api/sessions/[sessionId]/route", method: "GET", params: (i) => ({ sessionId: String(i.session) }) },
  { name: "PATCH /api/sessions/[id]", module: "@/app/api/sessions/[sessionId]/route", method: "PATCH", params: (i) => ({ sessionId: String(i.session) }), body: () => ({ version: 1, notes: "x" }) },
  { name: "PUT /api/sessions/[id]/results", module: "@/app/api/sessions/[sessionId]/results/route", method: "PUT", params: (i) => ({ sessionId: String(i.session) }), body: (i) => ({ results: [{ athleteId: i.athlete, testId: i.test, trials: [1], flag: null, version: 1 }] }) },
  { name: "POST /api/sessions/[id]/undo", module: "@/app/api/sessions/[sessionId]/undo/route", method: "POST", params: (i) => ({ sessionId: String(i.session) }) },
  {
    name: "POST /api/sessions/[id]/import", module: "@/app/api/sessions/[sessionId]/import/route", method: "POST", params: (i) => ({ sessionId: String(i.session) }),
    body: () => {
      const form = new FormData();
      form.set("file", new File(["athlete,test,trial,value\nNHW001,Countermovement jump,1,30\n"], "x.csv", { type: "text/csv" }));
      return form;
    },
  },
  { name: "GET /api/sessions/[id]/audit", module: "@/app/api/sessions/[sessionId]/audit/route", method: "GET", params: (i) => ({ sessionId: String(i.session) }) },
];

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let senior: Ids;
let clubNames: string[] = [];

beforeAll(async () => {
  env = await setupTestDatabase();
  const [squad] = await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women"));
  const [athlete] = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Maren Oduya"));
  const [session] = await env.db.select({ id: testingSessions.id }).from(testingSessions).where(eq(testingSessions.squadId, squad.id));
  const [test] = await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "Countermovement jump"));
  senior = { squad: squad.id, athlete: athlete.id, session: session.id, test: test.id };
  clubNames = (await env.db.select({ name: athletes.name }).from(athletes).where(eq(athletes.organizationId, 1))).map((a) => a.name);
});
afterAll(() => env.cleanup());

async function run(route: Route, ids: Ids) {
  const mod = await import(/* @vite-ignore */ route.module);
  return call(mod[route.method], { method: route.method, params: route.params?.(ids) ?? {}, body: route.body?.(ids) });
}

const leaked = (json: unknown, allowed: string[]) =>
  clubNames.filter((name) => !allowed.includes(name) && JSON.stringify(json).includes(name));

describe("access matrix", () => {
  it("anonymous: 401 on every route", async () => {
    await signInAs(null);
    for (const route of ROUTES) expect([route.name, (await run(route, senior)).status]).toEqual([route.name, 401]);
  });

  it("another organisation's owner: 404 or an empty answer for every demo-club record, and no names leak", async () => {
    await signInAs("owner@other.example.com");
    for (const route of ROUTES) {
      const { status, json } = await run(route, senior);
      expect([route.name, leaked(json, [])]).toEqual([route.name, []]);
      if (route.params || route.name.startsWith("POST /api/sessions") || route.name.startsWith("PUT")) {
        expect([route.name, status]).toEqual([route.name, 404]);
      }
    }
  });

  it("the athlete: refused on every staff route, and sees no other athlete anywhere", async () => {
    await signInAs("athlete@example.com");
    for (const route of ROUTES) {
      const { status, json } = await run(route, senior);
      expect([route.name, leaked(json, ["Tessa Lindqvist"])]).toEqual([route.name, []]);
      const readsOwnData = ["GET /api/me", "GET /api/athletes", "GET /api/tests", "GET /api/tests/[id]"].includes(route.name);
      if (!readsOwnData) expect([route.name, [403, 404].includes(status)]).toEqual([route.name, true]);
    }
  });

  it("the coach of Academy U18: refused or 404 for every Senior Women record, and no senior names leak", async () => {
    await signInAs("coach@example.com");
    const seniorNames = clubNames.slice(0, 18);
    for (const route of ROUTES) {
      const { status, json } = await run(route, senior);
      const seen = seniorNames.filter((n) => JSON.stringify(json).includes(n));
      expect([route.name, seen]).toEqual([route.name, []]);
      // The test library is organisation-wide: a coach reads every test.
      if ((route.params && route.name !== "GET /api/tests/[id]") || route.name.startsWith("POST /api/sessions")) {
        expect([route.name, [403, 404].includes(status)]).toEqual([route.name, true]);
      }
    }
  });
});
