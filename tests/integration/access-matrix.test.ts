/**
 * The authorisation matrix: every API route × method (found on disk) × eight callers, against
 * the demo club's records and against another organisation's, plus ids smuggled in bodies.
 * Each cell checks the exact status, that the answer names nothing the caller may not see
 * (names, external ids, record ids), and that a refused write changed nothing in the database.
 * A write that was allowed is undone by moving the app to a fresh copy of the seeded file.
 */
import { dirname } from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import { loadActor } from "@/lib/data/actors";
import { createInvitation } from "@/lib/data/invitations";
import { saveReport } from "@/lib/data/reports";
import { discoverApiRoutes, routeKeys } from "../helpers/api-routes";
import { setupTestDatabase, userIdOf } from "../helpers/db";
import { fingerprint, snapshotTo, switchToFreshCopy } from "../helpers/db-state";
import { forbiddenFor, leaksIn, loadWorld, numbersIn, type World } from "../helpers/reach";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

/** The callers, in the column order of the table below. */
const CALLERS = [
  ["anonymous", null],
  ["owner", "owner@example.com"],
  ["scientist", "scientist@example.com"],
  ["coach of the squad", "coach2@example.com"],
  ["coach of another squad", "coach@example.com"],
  ["athlete (self)", "athlete@example.com"],
  ["athlete (other)", "athlete2@example.com"],
  ["other organisation's owner", "owner@other.example.com"],
] as const;
type Status = number;
type Row = [Status, Status, Status, Status, Status, Status, Status, Status];

/** The records a row is aimed at: the demo club's Senior Women, or the other organisation's rowers. */
type Target = {
  squad: number;
  athlete: number;
  session: number;
  test: number;
  /** An earlier session of the same squad that measured `test` too (the Change report's pair). */
  preSession: number;
  /** The squad's test–retest pair (baseline and retest sessions), both measuring `test`. */
  baseline: number;
  retest: number;
  /** A saved Change report of the squad. */
  savedReport: number;
  /** A waiting invitation of the organisation, and a member (not its only owner) to aim at. */
  invitation: number;
  member: number;
  /** How many results `session` holds (what a deletion's confirm step saw). */
  sessionResults: number;
  /** A cell that holds a result (version 1) on `session`'s sheet, and a score for it. */
  cell: { athleteId: number; testId: number; value: number };
  csv: string;
};

type Request = { params?: Record<string, string>; body?: unknown; url?: string };
type Entry =
  | { exempt: string }
  | {
      expect: Row;
      request: (t: Target) => Request;
      /** Runs as the caller first (e.g. a change for undo to revert); its answer is not checked. */
      setup?: (t: Target) => Promise<unknown>;
      /** The row also runs against the other organisation's records (ids in the path or body). */
      aimed?: boolean;
    };

const sheetWrite = (t: Target) => ({
  results: [{ athleteId: t.cell.athleteId, testId: t.cell.testId, trials: [t.cell.value], flag: null, version: 1 }],
});
const csvForm = (t: Target) => {
  const form = new FormData();
  form.set("file", new File([`athlete,test,trial,value\n${t.csv}\n`], "scores.csv", { type: "text/csv" }));
  return form;
};
const route = (path: string) => import(/* @vite-ignore */ `@/app/api${path}/route`);

//                                                anon owner sci coach coach2 self other otherOrg
const MATRIX: Record<string, Entry> = {
  "GET /api/me": { expect: [401, 200, 200, 200, 200, 200, 200, 200], request: () => ({}) },
  // Athletes only, each about themself: no id to aim with, so nobody can ask about another.
  "GET /api/me/progress": { expect: [401, 403, 403, 403, 403, 200, 200, 403], request: () => ({}) },
  "GET /api/me/export": {
    expect: [401, 403, 403, 403, 403, 200, 200, 403],
    request: () => ({ url: "http://test.local/api/me/export?format=json" }),
  },
  "GET /api/squads": { expect: [401, 200, 200, 200, 200, 403, 403, 200], request: () => ({}) },
  "POST /api/squads": {
    expect: [401, 201, 403, 403, 403, 403, 403, 201],
    request: () => ({ body: { name: "Matrix squad" } }),
  },
  "GET /api/squads/[squadId]": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { squadId: `${t.squad}` } }),
  },
  "PATCH /api/squads/[squadId]": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { squadId: `${t.squad}` }, body: { sport: "Mixed" } }),
  },
  "GET /api/squads/[squadId]/athletes": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { squadId: `${t.squad}` } }),
  },
  "POST /api/squads/[squadId]/athletes": {
    expect: [401, 201, 201, 201, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { squadId: `${t.squad}` }, body: { name: "Matrix Newcomer" } }),
  },
  "GET /api/athletes": { expect: [401, 200, 200, 200, 200, 200, 200, 200], request: () => ({}) },
  "GET /api/athletes/[athleteId]": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { athleteId: `${t.athlete}` } }),
  },
  "PATCH /api/athletes/[athleteId]": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { athleteId: `${t.athlete}` }, body: { position: "MF" } }),
  },
  "GET /api/athletes/[athleteId]/results": {
    expect: [401, 200, 200, 200, 404, 200, 404, 404],
    aimed: true,
    request: (t) => ({ params: { athleteId: `${t.athlete}` } }),
  },
  "GET /api/athletes/[athleteId]/history": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { athleteId: `${t.athlete}` } }),
  },
  "GET /api/coaches": { expect: [401, 200, 200, 403, 403, 403, 403, 200], request: () => ({}) },
  "GET /api/tests": { expect: [401, 200, 200, 200, 200, 200, 200, 200], request: () => ({}) },
  "POST /api/tests": {
    expect: [401, 201, 201, 403, 403, 403, 403, 201],
    request: () => ({ body: { name: "Matrix hop", unit: "cm", direction: "higher" } }),
  },
  "GET /api/tests/[testId]": {
    expect: [401, 200, 200, 200, 200, 200, 200, 404],
    aimed: true,
    request: (t) => ({ params: { testId: `${t.test}` } }),
  },
  "PATCH /api/tests/[testId]": {
    expect: [401, 200, 200, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { testId: `${t.test}` }, body: { version: 1, typicalErrorSource: "Matrix" } }),
  },
  "DELETE /api/tests/[testId]": {
    expect: [401, 200, 200, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { testId: `${t.test}` } }),
  },
  "GET /api/sessions": { expect: [401, 200, 200, 200, 200, 403, 403, 200], request: () => ({}) },
  "POST /api/sessions": {
    expect: [401, 201, 201, 201, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ body: { squadId: t.squad, date: "2026-12-01", phase: "retest", testIds: [t.test] } }),
  },
  "GET /api/sessions/[sessionId]": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { sessionId: `${t.session}` } }),
  },
  "PATCH /api/sessions/[sessionId]": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { sessionId: `${t.session}` }, body: { version: 1, notes: "Matrix" } }),
  },
  "DELETE /api/sessions/[sessionId]": {
    // The coach did not create the demo's drafts: only their own drafts are theirs to delete. Not
    // aimed: the other organisation's only session is published, so nobody may delete it there.
    expect: [401, 200, 200, 403, 404, 403, 403, 404],
    request: (t) => ({
      params: { sessionId: `${t.session}` },
      url: `http://test.local/api/sessions/${t.session}?results=${t.sessionResults}`,
    }),
  },
  "PUT /api/sessions/[sessionId]/results": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { sessionId: `${t.session}` }, body: sheetWrite(t) }),
  },
  "POST /api/sessions/[sessionId]/undo": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    // Something of the caller's own to undo, where the caller may write at all.
    setup: async (t) =>
      call((await route("/sessions/[sessionId]/results")).PUT, {
        method: "PUT",
        params: { sessionId: `${t.session}` },
        body: sheetWrite(t),
      }),
    request: (t) => ({ params: { sessionId: `${t.session}` } }),
  },
  "GET /api/sessions/[sessionId]/publish-check": {
    expect: [401, 200, 200, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { sessionId: `${t.session}` } }),
  },
  "GET /api/sessions/[sessionId]/audit": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { sessionId: `${t.session}` } }),
  },
  "POST /api/sessions/[sessionId]/import": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    aimed: true,
    request: (t) => ({
      params: { sessionId: `${t.session}` },
      body: csvForm(t),
      url: "http://test.local/api?mode=preview",
    }),
  },
  "GET /api/reports/change": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    request: () => ({
      url: `http://test.local/api/reports/change?testId=${club.test}&fromSessionId=${club.preSession}&toSessionId=${club.session}`,
    }),
  },
  "GET /api/reports/change.csv": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    request: () => ({
      url: `http://test.local/api/reports/change.csv?testId=${club.test}&fromSessionId=${club.preSession}&toSessionId=${club.session}`,
    }),
  },
  "GET /api/reports/reliability": {
    expect: [401, 200, 200, 403, 403, 403, 403, 404],
    request: () => ({
      url: `http://test.local/api/reports/reliability?testId=${club.test}&firstSessionId=${club.baseline}&secondSessionId=${club.retest}`,
    }),
  },
  "POST /api/reports/reliability/file": {
    // The other organisation cannot score a file in this club's test.
    expect: [401, 200, 200, 403, 403, 403, 403, 404],
    request: () => ({
      body: {
        testId: club.test,
        confidence: 0.95,
        fileName: "pilot.csv",
        csv: "athlete,day 1,day 2\nA,1.90,1.92\nB,1.85,1.83\nC,2.01,2.04",
      },
    }),
  },
  "POST /api/tests/[testId]/typical-error": {
    // Not aimed: the other organisation has no test–retest pair to study.
    expect: [401, 200, 200, 403, 403, 403, 403, 404],
    request: (t) => ({
      params: { testId: `${t.test}` },
      body: { firstSessionId: t.baseline, secondSessionId: t.retest },
    }),
  },
  "GET /api/reports/notes": {
    expect: [401, 200, 200, 200, 200, 403, 403, 200],
    request: () => ({}),
  },
  "POST /api/reports/notes": {
    expect: [401, 201, 201, 403, 403, 403, 403, 404],
    request: () => ({
      body: {
        testId: club.test,
        fromSessionId: club.preSession,
        toSessionId: club.session,
        confidence: 0.9,
        note: "Matrix note",
      },
    }),
  },
  "GET /api/reports/notes/[reportId]": {
    expect: [401, 200, 200, 200, 404, 403, 403, 404],
    request: () => ({ params: { reportId: `${club.savedReport}` } }),
  },
  "GET /api/work-to-do": { expect: [401, 200, 200, 200, 200, 403, 403, 200], request: () => ({}) },
  "GET /api/invitations": { expect: [401, 200, 403, 403, 403, 403, 403, 200], request: () => ({}) },
  "POST /api/invitations": {
    expect: [401, 201, 403, 403, 403, 403, 403, 201],
    request: () => ({ body: { email: "matrix.invite@example.com", role: "coach" } }),
  },
  "DELETE /api/invitations/[invitationId]": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { invitationId: `${t.invitation}` } }),
  },
  "POST /api/invitations/[invitationId]/resend": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { invitationId: `${t.invitation}` } }),
  },
  // Public: the token is the credential, so every caller gets the same answer for one that opens nothing.
  "POST /api/invitations/accept": {
    expect: [404, 404, 404, 404, 404, 404, 404, 404],
    request: () => ({ body: { token: "A".repeat(43), name: "Matrix Person", password: "matrix-password" } }),
  },
  "POST /api/password-reset": {
    expect: [202, 202, 202, 202, 202, 202, 202, 202],
    request: () => ({ body: { email: "matrix.nobody@example.com" } }),
  },
  "POST /api/password-reset/confirm": {
    expect: [404, 404, 404, 404, 404, 404, 404, 404],
    request: () => ({ body: { token: "A".repeat(43), password: "matrix-password" } }),
  },
  "GET /api/members": { expect: [401, 200, 403, 403, 403, 403, 403, 200], request: () => ({}) },
  "GET /api/members/[userId]": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { userId: `${t.member}` } }),
  },
  // Not aimed: the other organisation's only member is its last owner (409 for a change of role).
  "PATCH /api/members/[userId]": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    request: (t) => ({ params: { userId: `${t.member}` }, body: { role: "scientist" } }),
  },
  "DELETE /api/members/[userId]": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    request: (t) => ({ params: { userId: `${t.member}` } }),
  },
  "POST /api/me/deletion-request": {
    expect: [401, 403, 403, 403, 403, 201, 201, 403],
    request: () => ({ body: { message: "Matrix request" } }),
  },
  "GET /api/deletion-requests": { expect: [401, 200, 403, 403, 403, 403, 403, 200], request: () => ({}) },
  "GET /api/athletes/[athleteId]/deletion": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { athleteId: `${t.athlete}` } }),
  },
  "DELETE /api/athletes/[athleteId]": {
    expect: [401, 200, 403, 403, 403, 403, 403, 404],
    aimed: true,
    request: (t) => ({ params: { athleteId: `${t.athlete}` } }),
  },
  "GET /api/outbox": { expect: [401, 200, 403, 403, 403, 403, 403, 200], request: () => ({}) },
  // Mail goes nowhere in these tests (no local fake), so there is no captured message to read.
  "GET /api/outbox/[messageId]": {
    expect: [401, 404, 403, 403, 403, 403, 403, 404],
    request: () => ({ params: { messageId: "2026-01-01T00-00-00.000Z-1-1.eml" } }),
  },
  "GET /api/auth/[...nextauth]": {
    exempt:
      "next-auth's own endpoints (csrf, providers, session): public by design; sign-in throttling and sign-out have their own tests",
  },
  "POST /api/auth/[...nextauth]": {
    exempt:
      "next-auth's sign-in and sign-out callbacks: public by design; covered by throttle.test.ts and sign-out.test.ts",
  },
};

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let world: World;
let template = "";
let pristine = "";
let club: Target;
let rowing: Target;
const tally = { cells: 0, leaks: [] as string[], wrong: [] as string[], changedWhenRefused: [] as string[] };

const byName = <T extends { name: string }>(list: T[], name: string) => {
  const found = list.find((x) => x.name === name);
  if (!found) throw new Error(`No demo record ${name}`);
  return found;
};

beforeAll(async () => {
  env = await setupTestDatabase();
  world = await loadWorld(getClient());
  const tessa = byName(world.athletes, "Tessa Lindqvist");
  const senior = byName(world.squads, "Senior Women");
  const cmj = byName(world.tests, "Countermovement jump");
  // The Senior Women post-block session: a draft, so its coach may write to it.
  const seniorDraft = world.sessions.filter((s) => s.squadId === senior.id && s.status === "draft").at(-1)!;
  const seniorPre = world.sessions.find((s) => s.squadId === senior.id && s.status === "published")!;
  const seniorPhase = async (phase: string) =>
    Number(
      (
        await getClient().execute({
          sql: "SELECT id FROM testing_sessions WHERE squad_id = ? AND phase = ?",
          args: [senior.id, phase],
        })
      ).rows[0][0],
    );
  const resultsOf = async (sessionId: number) =>
    Number(
      (await getClient().execute({ sql: "SELECT count(*) FROM results WHERE session_id = ?", args: [sessionId] }))
        .rows[0][0],
    );
  club = {
    sessionResults: await resultsOf(seniorDraft.id),
    squad: senior.id,
    baseline: await seniorPhase("baseline"),
    retest: await seniorPhase("retest"),
    athlete: tessa.id,
    session: seniorDraft.id,
    preSession: seniorPre.id,
    test: cmj.id,
    savedReport: 0,
    invitation: 0,
    member: await userIdOf("coach2@example.com"),
    cell: { athleteId: tessa.id, testId: cmj.id, value: 31.5 },
    csv: `${tessa.externalId},Countermovement jump,1,31.5`,
  };
  // A saved report of the squad to aim at, written as its sport scientist would.
  const scientist = await loadActor(await userIdOf("scientist@example.com"));
  club.savedReport = (
    await saveReport(scientist!, {
      testId: club.test,
      fromSessionId: club.preSession,
      toSessionId: club.session,
      confidence: 0.9,
      note: "Matrix",
    })
  ).id;
  const rower = byName(world.athletes, "Wren Abernathy");
  const erg = byName(world.tests, "2000 m ergometer");
  const rowingSquad = byName(world.squads, "Junior Sculling");
  const rowingSession = world.sessions.find((s) => s.squadId === rowingSquad.id)!.id;
  rowing = {
    sessionResults: await resultsOf(rowingSession),
    squad: rowingSquad.id,
    athlete: rower.id,
    session: rowingSession,
    preSession: rowingSession,
    baseline: rowingSession,
    retest: rowingSession,
    savedReport: 0,
    invitation: 0,
    member: await userIdOf("owner@other.example.com"),
    test: erg.id,
    cell: { athleteId: rower.id, testId: erg.id, value: 451.2 },
    csv: `${rower.externalId},2000 m ergometer,1,451.2`,
  };
  // A waiting invitation in each organisation, sent by its owner.
  const clubOwner = (await loadActor(await userIdOf("owner@example.com")))!;
  const otherOwner = (await loadActor(await userIdOf("owner@other.example.com")))!;
  club.invitation = (await createInvitation(clubOwner, { email: "matrix.waiting@example.com", role: "coach" })).id;
  rowing.invitation = (await createInvitation(otherOwner, { email: "matrix.rower@example.com", role: "coach" })).id;
  template = `${dirname(env.url.slice("file:".length))}/template.db`;
  await snapshotTo(template);
  switchToFreshCopy(template, dirname(template));
  pristine = await fingerprint();
});
afterAll(() => env.cleanup());

type Cell = {
  label: string;
  caller: (typeof CALLERS)[number];
  method: string;
  path: string;
  request: Request;
  expected: Status;
  setup?: () => Promise<unknown>;
};

/** Runs one cell and records a wrong status, a leak, or a refused write that changed something. */
async function check(cell: Cell) {
  const [who, email] = cell.caller;
  await signInAs(email);
  if (cell.setup) await cell.setup();
  const write = cell.method !== "GET";
  const before = write ? await fingerprint() : "";
  const handler = (await route(cell.path.replace(/^\/api/, "")))[cell.method];
  const { params = {}, body, url } = cell.request;
  const { status, json } = await call(handler, { method: cell.method, params, body, url });
  tally.cells++;
  const where = `${cell.label} as ${who}`;
  if (status !== cell.expected)
    tally.wrong.push(`${where}: ${status}, expected ${cell.expected} ${JSON.stringify(json).slice(0, 160)}`);
  if (
    status >= 400 &&
    !(json?.error && typeof json.error.code === "string" && typeof json.error.message === "string")
  ) {
    tally.wrong.push(`${where}: ${status} without the error shape`);
  }
  const file = body instanceof FormData ? body.get("file") : null;
  const sentText = file instanceof File ? await file.text() : JSON.stringify(body ?? null);
  for (const leak of leaksIn(json, forbiddenFor(world, email), numbersIn(params, body), sentText))
    tally.leaks.push(`${where}: ${leak}`);
  if (write) {
    const after = await fingerprint();
    if (status >= 400 && after !== before)
      tally.changedWhenRefused.push(`${where}: refused with ${status} but the database changed`);
    if (after !== pristine) switchToFreshCopy(template, dirname(template));
  }
}

const expectClean = () => {
  expect(tally.wrong).toEqual([]);
  expect(tally.changedWhenRefused).toEqual([]);
  expect(tally.leaks).toEqual([]);
};

describe("authorisation matrix", () => {
  it("has an entry for every route and method on disk, and none for routes that are gone", () => {
    const onDisk = routeKeys(discoverApiRoutes());
    expect(onDisk.length).toBeGreaterThan(20);
    expect(onDisk.filter((key) => !(key in MATRIX))).toEqual([]);
    expect(Object.keys(MATRIX).filter((key) => !onDisk.includes(key))).toEqual([]);
  });

  // Each of the next three sends hundreds of requests: more than the default 20 s on a busy two-core machine.
  it("every caller × every route, aimed at the demo club's Senior Women records", async () => {
    for (const [key, entry] of Object.entries(MATRIX)) {
      if ("exempt" in entry) continue;
      const [method, path] = key.split(" ");
      for (const [i, caller] of CALLERS.entries()) {
        await check({
          label: key,
          caller,
          method,
          path,
          request: entry.request(club),
          expected: entry.expect[i],
          setup: entry.setup && (() => entry.setup!(club)),
        });
      }
    }
    expectClean();
  }, 180_000);

  it("every caller × every route with an id, aimed at the other organisation's records", async () => {
    for (const [key, entry] of Object.entries(MATRIX)) {
      if ("exempt" in entry || !entry.aimed) continue;
      const [method, path] = key.split(" ");
      for (const [i, caller] of CALLERS.entries()) {
        const own = caller[1] === "owner@other.example.com";
        // Their own records answer the other owner as the club's answer its owner; to everyone
        // else in the club they do not exist (unless the role is refused before any lookup).
        const expected = own ? entry.expect[1] : [401, 403].includes(entry.expect[i]) ? entry.expect[i] : 404;
        await check({
          label: `${key} (other organisation)`,
          caller,
          method,
          path,
          request: entry.request(rowing),
          expected,
          setup: entry.setup && (() => entry.setup!(rowing)),
        });
      }
    }
    expectClean();
  }, 180_000);

  it("ids of other organisations and other squads sent in bodies and queries are refused", async () => {
    const academy = byName(world.squads, "Academy U18");
    const theo = byName(world.athletes, "Theo Varga");
    const seniorPublished = world.sessions.find((s) => s.squadId === club.squad && s.status === "published")!;
    const otherOwner = await userIdOf("owner@other.example.com");
    const coachId = await userIdOf("coach@example.com");
    const write = (t: Target, cell: Partial<Target["cell"]>) => ({
      results: [{ ...t.cell, ...cell, trials: [30], flag: null, version: null }],
    });
    const [, owner, , coach2, , , , other] = CALLERS;
    const cases: [(typeof CALLERS)[number], string, string, Request, Status][] = [
      [
        owner,
        "PUT",
        "/api/sessions/[sessionId]/results",
        { params: { sessionId: `${club.session}` }, body: write(club, { athleteId: rowing.athlete }) },
        404,
      ],
      [
        owner,
        "PUT",
        "/api/sessions/[sessionId]/results",
        { params: { sessionId: `${club.session}` }, body: write(club, { testId: rowing.test }) },
        422,
      ],
      [
        coach2,
        "PUT",
        "/api/sessions/[sessionId]/results",
        { params: { sessionId: `${club.session}` }, body: write(club, { athleteId: theo.id }) },
        404,
      ],
      [
        coach2,
        "PUT",
        "/api/sessions/[sessionId]/results",
        { params: { sessionId: `${seniorPublished.id}` }, body: sheetWrite(club) },
        403,
      ],
      [
        other,
        "PUT",
        "/api/sessions/[sessionId]/results",
        { params: { sessionId: `${rowing.session}` }, body: write(rowing, { athleteId: club.athlete }) },
        404,
      ],
      [
        other,
        "PUT",
        "/api/sessions/[sessionId]/results",
        { params: { sessionId: `${rowing.session}` }, body: write(rowing, { testId: club.test }) },
        422,
      ],
      [
        owner,
        "POST",
        "/api/squads/[squadId]/athletes",
        { params: { squadId: `${club.squad}` }, body: { athleteId: rowing.athlete } },
        404,
      ],
      [
        coach2,
        "POST",
        "/api/squads/[squadId]/athletes",
        { params: { squadId: `${club.squad}` }, body: { athleteId: theo.id } },
        404,
      ],
      [
        other,
        "POST",
        "/api/squads/[squadId]/athletes",
        { params: { squadId: `${rowing.squad}` }, body: { athleteId: club.athlete } },
        404,
      ],
      [
        owner,
        "POST",
        "/api/sessions",
        { body: { squadId: rowing.squad, date: "2026-12-01", phase: "retest", testIds: [club.test] } },
        404,
      ],
      [
        owner,
        "POST",
        "/api/sessions",
        { body: { squadId: club.squad, date: "2026-12-01", phase: "retest", testIds: [club.test, rowing.test] } },
        422,
      ],
      [
        coach2,
        "POST",
        "/api/sessions",
        { body: { squadId: academy.id, date: "2026-12-01", phase: "retest", testIds: [club.test] } },
        404,
      ],
      [
        other,
        "POST",
        "/api/sessions",
        { body: { squadId: rowing.squad, date: "2026-12-01", phase: "retest", testIds: [club.test] } },
        422,
      ],
      [
        other,
        "POST",
        "/api/sessions",
        { body: { squadId: club.squad, date: "2026-12-01", phase: "retest", testIds: [rowing.test] } },
        404,
      ],
      [
        owner,
        "PATCH",
        "/api/squads/[squadId]",
        { params: { squadId: `${club.squad}` }, body: { coachUserIds: [otherOwner] } },
        422,
      ],
      [
        other,
        "PATCH",
        "/api/squads/[squadId]",
        { params: { squadId: `${rowing.squad}` }, body: { coachUserIds: [coachId] } },
        422,
      ],
      [
        owner,
        "PATCH",
        "/api/athletes/[athleteId]",
        { params: { athleteId: `${club.athlete}` }, body: { squadIds: [rowing.squad] } },
        422,
      ],
      [
        coach2,
        "PATCH",
        "/api/athletes/[athleteId]",
        { params: { athleteId: `${club.athlete}` }, body: { squadIds: [academy.id] } },
        422,
      ],
      [
        owner,
        "PATCH",
        "/api/sessions/[sessionId]",
        { params: { sessionId: `${club.session}` }, body: { version: 1, testIds: [club.test, rowing.test] } },
        422,
      ],
      [
        coach2,
        "PATCH",
        "/api/sessions/[sessionId]",
        { params: { sessionId: `${club.session}` }, body: { version: 1, status: "published" } },
        403,
      ],
      [
        owner,
        "POST",
        "/api/sessions/[sessionId]/import",
        {
          params: { sessionId: `${club.session}` },
          body: csvForm({ ...club, csv: rowing.csv }),
          url: "http://test.local/api?mode=commit",
        },
        422,
      ],
      [
        coach2,
        "POST",
        "/api/sessions/[sessionId]/import",
        {
          params: { sessionId: `${club.session}` },
          body: csvForm({ ...club, csv: `${theo.externalId},Countermovement jump,1,30` }),
          url: "http://test.local/api?mode=commit",
        },
        422,
      ],
      [owner, "GET", "/api/sessions", { url: `http://test.local/api?squadId=${rowing.squad}` }, 404],
      [CALLERS[4], "GET", "/api/sessions", { url: `http://test.local/api?squadId=${club.squad}` }, 404],
    ];
    for (const [caller, method, path, request, expected] of cases) {
      await check({
        label: `${method} ${path} with ${JSON.stringify(request.body instanceof FormData ? "csv" : (request.body ?? request.url)).slice(0, 90)}`,
        caller,
        method,
        path,
        request,
        expected,
      });
    }
    expectClean();
  }, 90_000);

  it("the leak finder has teeth: the Senior Women roster, as the Academy coach would see it, is all leaks", async () => {
    await signInAs("owner@example.com");
    const { json } = await call((await route("/squads/[squadId]/athletes")).GET, {
      params: { squadId: `${club.squad}` },
    });
    const leaks = leaksIn(json, forbiddenFor(world, "coach@example.com"), new Set());
    expect(leaks).toContain('"Tessa Lindqvist"');
    expect(leaks).toContain(`athlete #${club.athlete}`);
    expect(leaksIn(json, forbiddenFor(world, "coach2@example.com"), new Set())).toEqual([]);
  });

  it("adds up", () => {
    console.log(`authorisation matrix: ${tally.cells} cells checked, ${tally.leaks.length} leaks`);
    expect(tally.cells).toBeGreaterThan(300);
    expect(tally.leaks).toHaveLength(0);
  });
});
