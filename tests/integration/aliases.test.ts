/**
 * Other names for tests and athletes: edited in the Test library, matched in the Import's
 * mapping step, remembered for the next file — and never allowed to make one name read as two.
 */
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, squads, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { storeChecksum, uploadTo } from "../helpers/import-upload";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const sessionsRoute = await import("@/app/api/sessions/route");
const testsRoute = await import("@/app/api/tests/route");
const testRoute = await import("@/app/api/tests/[testId]/route");
const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { academy: 0, cmj: 0, sprint10: 0, squat: 0, luca: 0 };

const idOf = async (table: typeof tests | typeof athletes, name: string) =>
  (await env.db.select({ id: table.id }).from(table).where(eq(table.name, name)))[0].id;

beforeAll(async () => {
  env = await setupTestDatabase();
  ids.academy = (await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Academy U18")))[0].id;
  ids.cmj = await idOf(tests, "Countermovement jump");
  ids.sprint10 = await idOf(tests, "10 m sprint");
  ids.squat = await idOf(tests, "Back squat 1RM");
  ids.luca = await idOf(athletes, "Luca Dempsey");
});
afterAll(() => env.cleanup());

async function testRow(testId: number) {
  return (await call(testRoute.GET, { params: { testId: String(testId) } })).json.test;
}
const patch = async (testId: number, body: Record<string, unknown>) =>
  call(testRoute.PATCH, {
    method: "PATCH",
    params: { testId: String(testId) },
    body: { version: (await testRow(testId)).version, ...body },
  });

describe("other names in the Test library", () => {
  it("stores them cleaned: trimmed, typed with commas, repeats and the test's own name dropped", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await patch(ids.sprint10, {
      aliases: " 10m sprint , 10M SPRINT,, 10 m sprint, Sprint 10",
    });
    expect(status).toBe(200);
    expect(json.test.aliases).toEqual(["10m sprint", "Sprint 10"]);
  });

  it("refuses a name that already reads as another test, beside the field", async () => {
    await signInAs("scientist@example.com");
    const taken = await patch(ids.squat, { aliases: ["Squat", "cmj"] });
    expect(taken.status).toBe(409);
    expect(taken.json.error.fields).toEqual({ aliases: "“cmj” reads as Countermovement jump; choose another name." });
    const asName = await patch(ids.squat, { aliases: ["Countermovement jump"] });
    expect(asName.status).toBe(409);
    const created = await call(testsRoute.POST, {
      method: "POST",
      body: { name: "CMJ", unit: "cm", direction: "higher" },
    });
    expect(created.status).toBe(409);
    expect(created.json.error.message).toBe("“CMJ” is another name of Countermovement jump. Remove it there first.");
  });

  it("refuses more than 12, or one longer than 60 characters, with a message", async () => {
    await signInAs("owner@example.com");
    const many = await patch(ids.squat, { aliases: Array.from({ length: 13 }, (_, i) => `Squat ${i}`) });
    expect(many.status).toBe(422);
    const long = await patch(ids.squat, { aliases: ["x".repeat(61)] });
    expect(long.status).toBe(422);
    expect(JSON.stringify(long.json.error)).toContain("60 characters");
  });

  it("is read only by staff who edit the library: a coach cannot change them", async () => {
    await signInAs("coach@example.com");
    const { status } = await patch(ids.cmj, { aliases: ["Jump"] });
    expect(status).toBe(403);
  });
});

describe("matches in the Import", () => {
  let sessionId = 0;
  const file = "athlete,test,trial,value\nLuca Dempsy,Jumping test,1,36.2\nLuca Dempsy,Jumping test,2,36.9\n";
  const upload = (fields: Record<string, string>, mode: "preview" | "commit" = "commit") =>
    uploadTo(importRoute.POST, sessionId, file, { mode, fields });

  beforeAll(async () => {
    await signInAs("coach@example.com");
    const { json } = await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId: ids.academy, date: "2026-01-14", phase: "in-season", testIds: [ids.cmj, ids.sprint10] },
    });
    sessionId = json.session.id;
  });

  it("refuses a match to an athlete off the roster or a test outside the battery, and writes nothing", async () => {
    await signInAs("coach@example.com");
    const before = await storeChecksum();
    const femi = await idOf(athletes, "Femi Castellane");
    const offRoster = await upload({ matches: JSON.stringify({ athletes: { "Luca Dempsy": femi } }) });
    expect(offRoster.status).toBe(422);
    expect(offRoster.json.error.message).toBe(
      "“Luca Dempsy” is matched to an athlete who is not on the Academy U18 roster. Choose the match again.",
    );
    const notJson = await upload({ matches: "{athletes" });
    expect(notJson.status).toBe(422);
    const badShape = await upload({ matches: JSON.stringify({ athletes: { x: "Luca" } }) });
    expect(badShape.status).toBe(422);
    expect(await storeChecksum()).toBe(before);
  });

  it("a coach's matches import the file; the athlete's other name is remembered, the test's is left to the library", async () => {
    await signInAs("coach@example.com");
    const matches = JSON.stringify({ athletes: { "Luca Dempsy": ids.luca }, tests: { "Jumping test": ids.cmj } });
    const versionBefore = (await testRow(ids.cmj)).version;
    const { status, json } = await upload({ matches, remember: "yes" });
    expect(status).toBe(200);
    expect(json).toMatchObject({
      counts: { values: 2, resultsCreated: 1 },
      remembered: [{ kind: "athlete", value: "Luca Dempsy", id: ids.luca, name: "Luca Dempsey" }],
      unremembered: [
        {
          kind: "test",
          value: "Jumping test",
          reason: "other names of tests are added by the owner or a sport scientist, in the Test library",
        },
      ],
    });
    const [luca] = await env.db.select({ aliases: athletes.aliases }).from(athletes).where(eq(athletes.id, ids.luca));
    expect(luca.aliases).toEqual(["Luca Dempsy"]);
    const cmj = await testRow(ids.cmj);
    expect(cmj.version).toBe(versionBefore);
    expect(cmj.aliases).toEqual(["CMJ"]);
  });

  it("a scientist's test match is remembered too (a new test version); a name someone else has is not", async () => {
    await signInAs("scientist@example.com");
    const versionBefore = (await testRow(ids.cmj)).version;
    const matches = JSON.stringify({
      athletes: { "Femi Castellane": ids.luca },
      tests: { "Jumping test": ids.cmj },
    });
    const text = "athlete,test,trial,value\nFemi Castellane,Jumping test,3,35.8\n";
    const { status, json } = await uploadTo(importRoute.POST, sessionId, text, {
      fields: { matches, remember: "yes", replace: "yes" },
    });
    expect(status).toBe(200);
    expect(json.remembered).toEqual([
      { kind: "test", value: "Jumping test", id: ids.cmj, name: "Countermovement jump" },
    ]);
    expect(json.unremembered).toEqual([
      { kind: "athlete", value: "Femi Castellane", reason: "“Femi Castellane” already names Femi Castellane" },
    ]);
    const cmj = await testRow(ids.cmj);
    expect(cmj.aliases).toEqual(["CMJ", "Jumping test"]);
    expect(cmj.version).toBe(versionBefore + 1);
  });

  it("remembers only names the file uses, with the forms' rules for other names", async () => {
    await signInAs("scientist@example.com");
    const long = `Luca ${"D".repeat(70)}`;
    const matches = JSON.stringify({
      athletes: { "Nobody Here": ids.luca, [long]: ids.luca },
      tests: { Bench: ids.sprint10 },
    });
    const text = `athlete,test,trial,value\n${long},10 m sprint,2,1.81\n`;
    const { status, json } = await uploadTo(importRoute.POST, sessionId, text, {
      fields: { matches, remember: "yes", replace: "yes" },
    });
    expect(status).toBe(200);
    expect(json.remembered).toEqual([]);
    expect(json.unremembered).toEqual([
      { kind: "athlete", value: long, reason: "another name is kept only with 1 to 60 visible characters" },
      { kind: "athlete", value: "Nobody Here", reason: "the file does not use this name" },
      { kind: "test", value: "Bench", reason: "the file does not use this name" },
    ]);
    const [luca] = await env.db.select({ aliases: athletes.aliases }).from(athletes).where(eq(athletes.id, ids.luca));
    expect(luca.aliases).toEqual(["Luca Dempsy"]);
  });

  it("without remember, a match serves this import only", async () => {
    await signInAs("scientist@example.com");
    const matches = JSON.stringify({ athletes: { "L Dempsey": ids.luca }, tests: {} });
    const text = "athlete,test,trial,value\nL Dempsey,10 m sprint,1,1.79\n";
    const { status, json } = await uploadTo(importRoute.POST, sessionId, text, { fields: { matches } });
    expect(status).toBe(200);
    expect(json.remembered).toEqual([]);
    const [luca] = await env.db.select({ aliases: athletes.aliases }).from(athletes).where(eq(athletes.id, ids.luca));
    expect(luca.aliases).toEqual(["Luca Dempsy"]);
  });
});

describe("other spellings on the Roster", () => {
  const athleteRoute = () => import("@/app/api/athletes/[athleteId]/route");
  it("a coach edits an athlete's other spellings; one that is another athlete's name is refused without naming them", async () => {
    await signInAs("coach@example.com");
    const { PATCH } = await athleteRoute();
    const edit = (aliases: unknown) =>
      call(PATCH, { method: "PATCH", params: { athleteId: String(ids.luca) }, body: { aliases } });
    const saved = await edit("Luca Dempsy, L. Dempsey, luca dempsey");
    expect(saved.status).toBe(200);
    const [luca] = await env.db.select({ aliases: athletes.aliases }).from(athletes).where(eq(athletes.id, ids.luca));
    expect(luca.aliases).toEqual(["Luca Dempsy", "L. Dempsey"]);
    // Femi Castellane is on a squad this coach does not reach.
    const taken = await edit(["Femi Castellane"]);
    expect(taken.status).toBe(409);
    expect(taken.json.error.fields.aliases).toBe(
      "“Femi Castellane” is already the name, external id or another name of an athlete in your club; a file could not tell them apart.",
    );
    // Mateo Rusk's external id: a file's "NHA010" rows are his, whatever else is typed here.
    const externalId = await edit(["NHA010"]);
    expect(externalId.status).toBe(409);
  });
});
