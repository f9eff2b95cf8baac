/**
 * The files in examples/, which the README invites a newcomer to import into the demo club, go
 * through the import route exactly as the Import screen sends them, on a freshly seeded demo
 * database, into the sessions the README names — so the README's promises about them hold.
 */
import { readFileSync } from "node:fs";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, results, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { storeChecksum, uploadTo } from "../helpers/import-upload";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");
const sessionsRoute = await import("@/app/api/sessions/route");
const changeRoute = await import("@/app/api/reports/change/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const squadId: Record<string, number> = {};
const testId: Record<string, number> = {};

const example = (name: string) => new Uint8Array(readFileSync(`examples/${name}`));
const importFile = (sessionId: number, name: string, mode: "preview" | "commit" = "commit") =>
  uploadTo(importRoute.POST, sessionId, example(name), { mode, filename: name });

async function sessionOf(squad: string, phase: "pre-block" | "post-block") {
  const [row] = await env.db
    .select({ id: testingSessions.id })
    .from(testingSessions)
    .where(and(eq(testingSessions.squadId, squadId[squad]), eq(testingSessions.phase, phase)));
  return row.id;
}
const postBlockOf = (squad: string) => sessionOf(squad, "post-block");

/** Who the Senior Women's 30 m sprint Change report pairs, and whom it leaves out. */
async function seniorSprintReport() {
  const query = new URLSearchParams({
    testId: String(testId["30 m sprint"]),
    fromSessionId: String(await sessionOf("Senior Women", "pre-block")),
    toSessionId: String(await postBlockOf("Senior Women")),
    confidence: "0.9",
  });
  const { status, json } = await call(changeRoute.GET, { url: `http://test.local/api/reports/change?${query}` });
  expect(status).toBe(200);
  return { n: json.squad.n as number, leftOut: (json.excluded as { name: string }[]).map((e) => e.name) };
}

/** The session the README asks for: Academy U18, in-season, with the two sprints in its battery. */
async function newSpeedSession() {
  const { status, json } = await call(sessionsRoute.POST, {
    method: "POST",
    url: "http://test.local/api/sessions",
    body: {
      squadId: squadId["Academy U18"],
      date: "2026-11-30",
      phase: "in-season",
      testIds: [testId["10 m sprint"], testId["30 m sprint"]],
    },
  });
  expect(status).toBe(201);
  return json.session.id as number;
}

async function storedBest(sessionId: number, athlete: string, test: string) {
  const [row] = await env.db
    .select({ trials: results.trials, value: results.value })
    .from(results)
    .innerJoin(athletes, eq(athletes.id, results.athleteId))
    .where(and(eq(results.sessionId, sessionId), eq(athletes.name, athlete), eq(results.testId, testId[test])));
  return row;
}

beforeAll(async () => {
  env = await setupTestDatabase();
  for (const s of await env.db.select({ id: squads.id, name: squads.name }).from(squads)) squadId[s.name] = s.id;
  for (const t of await env.db
    .select({ id: tests.id, name: tests.name })
    .from(tests)
    .where(eq(tests.organizationId, 1)))
    testId[t.name] = t.id;
});
afterAll(() => env.cleanup());

describe("examples/ imported into the demo club", () => {
  it("senior-post-block-catch-up.csv (long format) fills the two gaps of the Senior Women post-block session", async () => {
    await signInAs("coach2@example.com");
    const sessionId = await postBlockOf("Senior Women");
    expect(await seniorSprintReport()).toEqual({ n: 16, leftOut: ["Femi Castellane", "Yuki Ferreira"] });
    const preview = await importFile(sessionId, "senior-post-block-catch-up.csv", "preview");
    expect(preview.status).toBe(200);
    expect(preview.json).toMatchObject({
      format: "long",
      errorCount: 0,
      warningCount: 0,
      canCommit: true,
      counts: { values: 22, resultsCreated: 10, resultsUpdated: 0, trialsReplaced: 0 },
    });

    const { status, json } = await importFile(sessionId, "senior-post-block-catch-up.csv");
    expect(status).toBe(200);
    expect(json).toMatchObject({ mode: "commit", rowsImported: 22, counts: { resultsCreated: 10 } });
    // Best of three: the highest jump, the fastest time.
    expect(await storedBest(sessionId, "Femi Castellane", "Countermovement jump")).toEqual({
      trials: [41.2, 42, 40.6],
      value: 42,
    });
    expect((await storedBest(sessionId, "Yuki Ferreira", "10 m sprint")).value).toBe(1.89);
    expect(await seniorSprintReport()).toEqual({ n: 18, leftOut: [] });
  });

  it("academy-speed-gates.csv (wide, semicolons and decimal commas) imports into a new in-season session", async () => {
    await signInAs("coach@example.com");
    const sessionId = await newSpeedSession();
    const preview = await importFile(sessionId, "academy-speed-gates.csv", "preview");
    expect(preview.status).toBe(200);
    expect(preview.json).toMatchObject({
      format: "wide",
      delimiter: ";",
      decimalComma: true,
      errorCount: 0,
      canCommit: true,
      // 12 athletes × 2 sprints × 3 runs, less the two runs Kwame Lindholm did not make.
      counts: { values: 70, resultsCreated: 24, trialsReplaced: 0 },
    });
    const date = preview.json.suggestions.find((s: { header: string }) => s.header === "Date");
    expect(date.status).toBe("ignored");

    const { status } = await importFile(sessionId, "academy-speed-gates.csv");
    expect(status).toBe(200);
    expect(await storedBest(sessionId, "Theo Varga", "30 m sprint")).toEqual({
      trials: [3.98, 4.01, 3.97],
      value: 3.97,
    });
    expect((await storedBest(sessionId, "Kwame Lindholm", "10 m sprint")).trials).toEqual([1.78, 1.77]);
  });

  it("academy-speed-gates-typo.csv is refused with the row and column of its one bad cell, and writes nothing", async () => {
    await signInAs("coach@example.com");
    const sessionId = await newSpeedSession();
    const before = await storeChecksum();
    const { status, json } = await importFile(sessionId, "academy-speed-gates-typo.csv");
    expect(status).toBe(422);
    expect(json.error.message).toBe("1 problem in the file. Nothing was imported.");
    expect(json.error.rows).toEqual([{ row: 12, column: "30 m sprint T2", message: "“4,O8” is not a number." }]);
    expect(await storeChecksum()).toBe(before);
  });

  it("academy-post-block-catch-up-misspelt.csv reads CMJ by its other name, and imports once the misspelt name is matched", async () => {
    await signInAs("coach@example.com");
    const sessionId = await postBlockOf("Academy U18");
    const [luca] = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Luca Dempsey"));
    const before = await storeChecksum();
    const { status, json } = await importFile(sessionId, "academy-post-block-catch-up-misspelt.csv");
    expect(status).toBe(422);
    expect(json.error.message).toBe("3 problems in the file. Nothing was imported.");
    expect(json.error.details.unknownAthletes).toEqual([
      // "Did you mean …?" (lib/import/suggest.ts), with the id the mapping step's "Use …" sends.
      {
        value: "Luca Dempsy",
        reason: "unknown",
        count: 3,
        rows: [5, 6, 7],
        suggestions: [{ id: luca.id, name: "Luca Dempsey" }],
      },
    ]);
    // "CMJ" is another name of the countermovement jump in the demo's Test library.
    expect(json.error.details.unknownTests).toEqual([]);
    expect(json.error.rows).toContainEqual({
      row: 5,
      column: "athlete",
      message:
        "No athlete “Luca Dempsy” on the Academy U18 roster (matched by external id, then by name). Match the name above (Names in the file), add them to the Roster, or correct the file.",
    });
    expect(await storeChecksum()).toBe(before);

    // The mapping step's two clicks: "Use Luca Dempsey" (remembered for next time), then Import.
    const fields = { matches: JSON.stringify({ athletes: { "Luca Dempsy": luca.id } }), remember: "yes" };
    const preview = await uploadTo(importRoute.POST, sessionId, example("academy-post-block-catch-up-misspelt.csv"), {
      mode: "preview",
      fields,
    });
    expect(preview.json).toMatchObject({ errorCount: 0, canCommit: true, unknownAthletes: [] });
    const committed = await uploadTo(importRoute.POST, sessionId, example("academy-post-block-catch-up-misspelt.csv"), {
      fields,
      filename: "academy-post-block-catch-up-misspelt.csv",
    });
    expect(committed.status).toBe(200);
    expect(committed.json).toMatchObject({
      rowsImported: 11,
      counts: { values: 11, resultsCreated: 5 },
      remembered: [{ kind: "athlete", value: "Luca Dempsy", id: luca.id, name: "Luca Dempsey" }],
      unremembered: [],
    });
    expect(await storedBest(sessionId, "Luca Dempsey", "Countermovement jump")).toEqual({
      trials: [36.1, 36.8, 35.9],
      value: 36.8,
    });

    // The next file that spells him so is read without asking.
    const again = await importFile(sessionId, "academy-post-block-catch-up-misspelt.csv", "preview");
    expect(again.json).toMatchObject({ errorCount: 0, counts: { resultsUnchanged: 5, resultsCreated: 0 } });
  });
});
