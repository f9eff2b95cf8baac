/**
 * JSON fuzzing of every route that reads a JSON body (found on disk by its `readJson` call):
 * a seeded stream of hostile bodies as the owner and as a coach. No answer may be a 5xx, every
 * refusal has the one error shape, and a refused write leaves the results table exactly as it was.
 * Each route starts from a fresh copy of the seeded database, so one route's accepted writes
 * (an archived squad, a moved athlete) do not blunt the next route's cases.
 */
import { dirname } from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import { discoverApiRoutes } from "../helpers/api-routes";
import { setupTestDatabase, userIdOf } from "../helpers/db";
import { resultsChecksum, snapshotTo, switchToFreshCopy } from "../helpers/db-state";
import { type FuzzCase, mutate, seeded, sweep, toJson } from "../helpers/fuzz";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const SEED = 20260917;
const RANDOM_AS_OWNER = 100;
const RANDOM_AS_COACH = 30;

type Ids = {
  senior: number;
  tessa: number;
  cmj: number;
  mean: number;
  session: number;
  coach2: number;
  /** The Senior Women pre-block and post-block sessions: a pair a Change report can be saved for. */
  pre: number;
  post: number;
  /** The Senior Women test–retest pair (baseline and retest): a reliability study of the CMJ. */
  baseline: number;
  retest: number;
};
type Base = {
  params: (ids: Ids) => Record<string, string>;
  body: (ids: Ids) => Promise<Record<string, unknown>>;
  specials?: (ids: Ids) => FuzzCase[];
};

const scalar = async (sql: string, args: (number | string)[]) =>
  Number((await getClient().execute({ sql, args })).rows[0]?.[0] ?? 0);
const version = (table: string, id: number) => scalar(`SELECT version FROM ${table} WHERE id = ?`, [id]);
const cellVersion = async (ids: Ids) => {
  const v = await scalar("SELECT version FROM results WHERE session_id = ? AND athlete_id = ? AND test_id = ?", [
    ids.session,
    ids.tessa,
    ids.mean,
  ]);
  return v || null;
};
const asJson = (kind: string, value: unknown): FuzzCase => ({
  kind,
  text: toJson(value),
  contentType: "application/json",
  value,
});

/** A valid body for every JSON route; the fuzzer breaks it. Versions are read fresh each time. */
const BASES: Record<string, Base> = {
  "POST /api/invitations": {
    params: () => ({}),
    body: async () => ({ email: "fuzz.invite@example.com", role: "coach" }),
    specials: (i) => [
      asJson("athlete with an account", { email: "fuzz.athlete@example.com", role: "athlete", athleteId: i.tessa }),
      asJson("staff role naming an athlete", { email: "fuzz.staff@example.com", role: "coach", athleteId: i.tessa }),
    ],
  },
  // A well-formed token that opens nothing: the fuzzer's variations must never reach a 500.
  "POST /api/invitations/accept": {
    params: () => ({}),
    body: async () => ({ token: "A".repeat(43), name: "Fuzz Person", password: "a-long-password" }),
  },
  "POST /api/password-reset": { params: () => ({}), body: async () => ({ email: "fuzz.reset@example.com" }) },
  "POST /api/password-reset/confirm": {
    params: () => ({}),
    body: async () => ({ token: "A".repeat(43), password: "a-long-password" }),
  },
  "PATCH /api/members/[userId]": {
    params: (i) => ({ userId: `${i.coach2}` }),
    body: async () => ({ role: "scientist" }),
  },
  "POST /api/me/deletion-request": { params: () => ({}), body: async () => ({ message: "Fuzzed request" }) },
  "POST /api/squads": { params: () => ({}), body: async () => ({ name: "Fuzz Squad", sport: "Rugby" }) },
  "PATCH /api/squads/[squadId]": {
    params: (i) => ({ squadId: `${i.senior}` }),
    body: async (i) => ({ name: "Senior Women", sport: "Football", archived: false, coachUserIds: [i.coach2] }),
  },
  "POST /api/squads/[squadId]/athletes": {
    params: (i) => ({ squadId: `${i.senior}` }),
    body: async () => ({
      name: "Fuzz Athlete",
      dateOfBirth: "2001-02-03",
      sex: "female",
      position: "MF",
      externalId: "FZ001",
      notes: "Fuzzed",
    }),
    specials: (i) => [
      asJson("existing athlete by id", { athleteId: i.tessa }),
      asJson("both shapes at once", { athleteId: i.tessa, name: "Both" }),
    ],
  },
  "PATCH /api/athletes/[athleteId]": {
    params: (i) => ({ athleteId: `${i.tessa}` }),
    body: async (i) => ({
      name: "Tessa Lindqvist",
      position: "DF",
      sex: "female",
      dateOfBirth: "1995-02-08",
      archived: false,
      squadIds: [i.senior],
    }),
  },
  "POST /api/tests": {
    params: () => ({}),
    body: async () => ({
      name: "Fuzz hop",
      unit: "cm",
      decimals: 1,
      direction: "higher",
      trialRule: "mean",
      trialsPerSession: 3,
      swcMethod: "sd-factor",
      swcValue: 0.2,
      cvPercent: null,
      typicalError: 0.5,
      typicalErrorDf: 10,
      typicalErrorSource: "Fuzz",
      plausibleMin: 0,
      plausibleMax: 100,
      aliases: ["FH", "Fuzz hop test"],
    }),
    specials: () => [
      asJson("cv-factor without CV", { name: "Fuzz cv", unit: "cm", direction: "higher", swcMethod: "cv-factor" }),
      asJson("range upside down", {
        name: "Fuzz range",
        unit: "cm",
        direction: "higher",
        plausibleMin: 10,
        plausibleMax: 1,
      }),
    ],
  },
  "PATCH /api/tests/[testId]": {
    params: (i) => ({ testId: `${i.mean}` }),
    body: async (i) => ({
      version: await version("tests", i.mean),
      name: "Drop jump contact time",
      aliases: "DJ contact, Drop jump CT",
      decimals: 2,
      trialsPerSession: 3,
      typicalError: 0.01,
      plausibleMin: 0.1,
      plausibleMax: 0.6,
    }),
  },
  "POST /api/reports/notes": {
    params: () => ({}),
    body: async (i) => ({
      testId: i.cmj,
      fromSessionId: i.pre,
      toSessionId: i.post,
      confidence: 0.9,
      note: "Fuzz note",
    }),
  },
  "POST /api/reports/reliability/file": {
    params: () => ({}),
    body: async (i) => ({
      testId: i.cmj,
      confidence: 0.95,
      fileName: "pilot.csv",
      csv: "athlete;day 1;day 2\nA;31,2;30,8\nB;28,4;29,0\nC;35,1;34,6",
    }),
  },
  "POST /api/tests/[testId]/typical-error": {
    params: (i) => ({ testId: `${i.cmj}` }),
    body: async (i) => ({ firstSessionId: i.baseline, secondSessionId: i.retest }),
  },
  "POST /api/sessions": {
    params: () => ({}),
    body: async (i) => ({
      squadId: i.senior,
      date: "2026-12-07",
      phase: "retest",
      testIds: [i.cmj, i.mean],
      notes: "Fuzz",
    }),
    specials: (i) => [
      asJson("31 tests", {
        squadId: i.senior,
        date: "2026-12-07",
        phase: "retest",
        testIds: Array.from({ length: 31 }, () => i.cmj),
      }),
      asJson("30 February", { squadId: i.senior, date: "2026-02-30", phase: "retest", testIds: [i.cmj] }),
    ],
  },
  "PATCH /api/sessions/[sessionId]": {
    params: (i) => ({ sessionId: `${i.session}` }),
    body: async (i) => ({
      version: await version("testing_sessions", i.session),
      date: "2026-12-05",
      phase: "retest",
      notes: "Fuzz",
      testIds: [i.cmj, i.mean],
    }),
  },
  "PUT /api/sessions/[sessionId]/results": {
    params: (i) => ({ sessionId: `${i.session}` }),
    body: async (i) => ({
      results: [
        {
          athleteId: i.tessa,
          testId: i.mean,
          trials: [0.21, 0.23],
          flag: null,
          note: "Fuzz",
          version: await cellVersion(i),
        },
      ],
    }),
    specials: (i) => {
      const cell = (extra: Record<string, unknown>) => ({
        athleteId: i.tessa,
        testId: i.mean,
        trials: [0.2],
        flag: null,
        version: null,
        ...extra,
      });
      return [
        asJson("11 trials", { results: [cell({ trials: Array.from({ length: 11 }, () => 0.2) })] }),
        asJson("5001 results", { results: Array.from({ length: 5001 }, () => cell({})) }),
        asJson("the same cell twice", { results: [cell({}), cell({})] }),
        asJson("only empty trials", { results: [cell({ trials: [null, null] })] }),
        asJson("absent with no trials", { results: [cell({ trials: [], flag: "absent" })] }),
        asJson("unknown flag", { results: [cell({ flag: "sick" })] }),
        asJson("501-character note", { results: [cell({ note: "n".repeat(501) })] }),
        asJson("huge negative trials on a best-of test", {
          results: [cell({ testId: i.cmj, trials: [-1e308, -1e308] })],
        }),
      ];
    },
  },
};

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let template = "";
let ids: Ids;

beforeAll(async () => {
  env = await setupTestDatabase();
  const one = async (sql: string) => Number((await getClient().execute(sql)).rows[0][0]);
  const senior = await one("SELECT id FROM squads WHERE name = 'Senior Women'");
  const tessa = await one("SELECT id FROM athletes WHERE name = 'Tessa Lindqvist'");
  const cmj = await one("SELECT id FROM tests WHERE name = 'Countermovement jump'");
  // A mean-of-trials test in a fresh draft session: the sheet save then averages what it is given.
  await signInAs("owner@example.com");
  const testsRoute = await import("@/app/api/tests/route");
  const created = await call(testsRoute.POST, {
    method: "POST",
    body: {
      name: "Drop jump contact time",
      unit: "s",
      decimals: 3,
      direction: "lower",
      trialRule: "mean",
      trialsPerSession: 3,
    },
  });
  const sessionsRoute = await import("@/app/api/sessions/route");
  const session = await call(sessionsRoute.POST, {
    method: "POST",
    body: { squadId: senior, date: "2026-12-05", phase: "retest", testIds: [cmj, created.json.test.id] },
  });
  ids = {
    senior,
    tessa,
    cmj,
    mean: created.json.test.id,
    session: session.json.session.id,
    coach2: await userIdOf("coach2@example.com"),
    pre: await one(`SELECT id FROM testing_sessions WHERE squad_id = ${senior} AND phase = 'pre-block'`),
    post: await one(`SELECT id FROM testing_sessions WHERE squad_id = ${senior} AND phase = 'post-block'`),
    baseline: await one(`SELECT id FROM testing_sessions WHERE squad_id = ${senior} AND phase = 'baseline'`),
    retest: await one(
      `SELECT id FROM testing_sessions WHERE squad_id = ${senior} AND phase = 'retest' ORDER BY id LIMIT 1`,
    ),
  };
  template = `${dirname(env.url.slice("file:".length))}/fuzz-template.db`;
  await snapshotTo(template);
});
afterAll(() => env.cleanup());

async function send(
  handler: (r: Request, c: { params: Promise<Record<string, string>> }) => Promise<Response>,
  method: string,
  params: Record<string, string>,
  c: FuzzCase,
) {
  const headers: Record<string, string> = { ...(c.headers ?? {}) };
  if (c.contentType) headers["content-type"] = c.contentType;
  // Bytes, not a string: a string body would get a text/plain type the case did not ask for.
  const body = c.text === undefined ? undefined : new TextEncoder().encode(c.text);
  const response = await handler(new Request("http://test.local/api", { method, headers, body }), {
    params: Promise.resolve(params),
  });
  const text = await response.text();
  let json: any;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  return { status: response.status, json, text };
}

const hasErrorShape = (json: any) =>
  json !== null &&
  typeof json === "object" &&
  Object.keys(json).join() === "error" &&
  typeof json.error?.code === "string" &&
  typeof json.error?.message === "string" &&
  json.error.message.length > 0;

const tally = {
  requests: 0,
  byStatus: {} as Record<number, number>,
  serverErrors: [] as string[],
  badShape: [] as string[],
  changedWhenRefused: [] as string[],
};

describe("JSON fuzzing", () => {
  it("every route that reads JSON has a valid base body to start from", () => {
    const jsonRoutes = discoverApiRoutes().flatMap((r) => r.jsonMethods.map((m) => `${m} ${r.path}`));
    expect(jsonRoutes.length).toBeGreaterThanOrEqual(9);
    expect(jsonRoutes.filter((key) => !(key in BASES))).toEqual([]);
  });

  it("hostile bodies as the owner and as a coach: no 5xx, one error shape, refused writes change nothing", async () => {
    for (const [key, base] of Object.entries(BASES)) {
      switchToFreshCopy(template, dirname(template));
      const [method, path] = key.split(" ");
      const handler = (await import(/* @vite-ignore */ `@/app${path}/route`))[method];
      let hash = 0;
      for (const ch of key) hash = (hash * 31 + ch.charCodeAt(0)) >>> 0;
      const rng = seeded(SEED ^ hash);
      const plan: [string, () => Promise<FuzzCase[]>][] = [
        ["owner@example.com", async () => [...sweep(await base.body(ids), rng), ...(base.specials?.(ids) ?? [])]],
        ...Array.from(
          { length: RANDOM_AS_OWNER },
          () =>
            ["owner@example.com", async () => [mutate(await base.body(ids), rng)]] as [
              string,
              () => Promise<FuzzCase[]>,
            ],
        ),
        ...Array.from(
          { length: RANDOM_AS_COACH },
          () =>
            ["coach2@example.com", async () => [mutate(await base.body(ids), rng)]] as [
              string,
              () => Promise<FuzzCase[]>,
            ],
        ),
      ];
      for (const [email, make] of plan) {
        await signInAs(email);
        for (const c of await make()) {
          const before = await resultsChecksum();
          const { status, json, text } = await send(handler, method, base.params(ids), c);
          tally.requests++;
          tally.byStatus[status] = (tally.byStatus[status] ?? 0) + 1;
          const where = `${key} as ${email}: ${c.kind}`;
          if (status >= 500) {
            const line = `${where} → ${status} ${text.slice(0, 200)} (body: ${(c.text ?? "").slice(0, 200)})`;
            tally.serverErrors.push(line);
          }
          if (status >= 400 && !hasErrorShape(json)) tally.badShape.push(`${where} → ${status} ${text.slice(0, 120)}`);
          if (status < 400 && (json === null || typeof json !== "object"))
            tally.badShape.push(`${where} → ${status} without a JSON object`);
          if (status >= 400 && (await resultsChecksum()) !== before)
            tally.changedWhenRefused.push(`${where} → ${status}, results changed`);
        }
      }
    }
    const byStatus = Object.fromEntries(Object.entries(tally.byStatus).sort());
    const fiveXx = tally.serverErrors.length;
    console.log(`json fuzz: ${tally.requests} requests, by status ${JSON.stringify(byStatus)}, ${fiveXx} 5xx`);
    for (const line of tally.serverErrors) console.log(`  5xx: ${line}`);
    expect(tally.requests).toBeGreaterThanOrEqual(1000);
    expect(tally.serverErrors).toEqual([]);
    expect(tally.badShape).toEqual([]);
    expect(tally.changedWhenRefused).toEqual([]);
  }, 180_000);

  // Once a 500: the mean of two finite trials overflowed to Infinity, which libSQL refused to store.
  it("trials [1e308, 1e308] on a mean-of-trials test answer 422 and store nothing", async () => {
    switchToFreshCopy(template, dirname(template));
    await signInAs("owner@example.com");
    const handler = (await import("@/app/api/sessions/[sessionId]/results/route")).PUT;
    const before = await resultsChecksum();
    const { status } = await call(handler, {
      method: "PUT",
      params: { sessionId: `${ids.session}` },
      body: {
        results: [{ athleteId: ids.tessa, testId: ids.mean, trials: [1e308, 1e308], flag: null, version: null }],
      },
    });
    expect(status).toBe(422);
    expect(await resultsChecksum()).toBe(before);
  });
});
