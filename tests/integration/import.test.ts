import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import { athletes, auditEvents, results, sessionTests, squads, testingSessions, tests, uploads } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { academy: 0, senior: 0, academyPost: 0, academyPre: 0, seniorPost: 0 };
const testId: Record<string, number> = {};

async function newSession(squadId: number, date: string) {
  const [session] = await env.db
    .insert(testingSessions)
    .values({ organizationId: 1, squadId, date, phase: "retest" })
    .returning({ id: testingSessions.id });
  await env.db
    .insert(sessionTests)
    .values(Object.values(testId).map((id, position) => ({ sessionId: session.id, testId: id, position })));
  return session.id;
}

beforeAll(async () => {
  env = await setupTestDatabase();
  for (const s of await env.db.select({ id: squads.id, name: squads.name }).from(squads)) {
    if (s.name === "Academy U18") ids.academy = s.id;
    if (s.name === "Senior Women") ids.senior = s.id;
  }
  const sessions = await env.db
    .select({ id: testingSessions.id, squadId: testingSessions.squadId, phase: testingSessions.phase })
    .from(testingSessions);
  ids.academyPost = sessions.find((s) => s.squadId === ids.academy && s.phase === "post-block")!.id;
  ids.academyPre = sessions.find((s) => s.squadId === ids.academy && s.phase === "pre-block")!.id;
  ids.seniorPost = sessions.find((s) => s.squadId === ids.senior && s.phase === "post-block")!.id;
  for (const t of await env.db
    .select({ id: tests.id, name: tests.name })
    .from(tests)
    .where(eq(tests.organizationId, 1)))
    testId[t.name] = t.id;
});
afterAll(() => env.cleanup());

type Upload = { fields?: Record<string, string>; mode?: "preview" | "commit"; filename?: string; query?: string };

function post(
  sessionId: number,
  body: BodyInit | FormData | undefined,
  {
    mode = "commit",
    query = "",
    headers = {},
  }: { mode?: string; query?: string; headers?: Record<string, string> } = {},
) {
  return call(importRoute.POST, {
    url: `http://test.local/api/sessions/${sessionId}/import?mode=${mode}${query}`,
    method: "POST",
    params: { sessionId: String(sessionId) },
    body: body as never,
    headers,
  });
}

function upload(
  sessionId: number,
  content: string | Uint8Array,
  { fields = {}, mode = "commit", filename = "scores.csv", query = "" }: Upload = {},
) {
  const form = new FormData();
  form.set("file", new File([content as BlobPart], filename, { type: "text/csv" }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return post(sessionId, form, { mode, query });
}

async function tableCounts() {
  const n = async (table: typeof results | typeof uploads | typeof auditEvents) =>
    (await env.db.select({ n: count() }).from(table))[0].n;
  const versions = await env.db.select({ v: results.version }).from(results);
  return {
    results: await n(results),
    uploads: await n(uploads),
    audit: await n(auditEvents),
    versionSum: versions.reduce((s, r) => s + r.v, 0),
  };
}

async function resultsOf(sessionId: number) {
  return env.db
    .select({
      athlete: athletes.name,
      externalId: athletes.externalId,
      test: tests.name,
      trials: results.trials,
      value: results.value,
      version: results.version,
      updatedBy: results.updatedBy,
    })
    .from(results)
    .innerJoin(athletes, eq(athletes.id, results.athleteId))
    .innerJoin(tests, eq(tests.id, results.testId))
    .where(eq(results.sessionId, sessionId));
}

const expectRow = (json: any, row: number, column?: string) =>
  expect(json.error.rows).toEqual(
    expect.arrayContaining([
      expect.objectContaining({ row, ...(column ? { column } : {}), message: expect.any(String) }),
    ]),
  );

describe("long format", () => {
  const csv = [
    "athlete,test,trial,value",
    "NHA001,Countermovement jump,1,41.2",
    "NHA001,Countermovement jump,2,42.0",
    "Callum Adeyemi,Countermovement jump,1,38.5",
    "callum adeyemi ,10 m sprint,1,1.82",
    "Callum Adeyemi,10 m sprint,2,1.79",
    "NHA003,Back squat 1RM,1,",
  ].join("\n");

  it("preview reads the file and writes nothing", async () => {
    await signInAs("coach@example.com");
    const sessionId = await newSession(ids.academy, "2026-12-01");
    const before = await tableCounts();
    const { status, json } = await upload(sessionId, csv, { mode: "preview" });
    expect(status).toBe(200);
    expect(json).toMatchObject({
      mode: "preview",
      format: "long",
      delimiter: ",",
      headers: ["athlete", "test", "trial", "value"],
      rowCount: 6,
      errorCount: 0,
      canCommit: true,
      counts: { values: 5, resultsCreated: 3, resultsUpdated: 0, trialsReplaced: 0 },
      unknownAthletes: [],
      unknownTests: [],
    });
    expect(json.sample).toHaveLength(6);
    expect(json.parsed[0]).toMatchObject({
      row: 2,
      athleteName: "Jonah Pellegrini",
      testName: "Countermovement jump",
      trial: 1,
      value: 41.2,
    });
    expect(await tableCounts()).toEqual(before);
  });

  it("commit writes results, the raw upload and one audit event, readable afterwards", async () => {
    await signInAs("coach@example.com");
    const sessionId = await newSession(ids.academy, "2026-12-02");
    const before = await tableCounts();
    const { status, json } = await upload(sessionId, csv);
    expect(status).toBe(200);
    expect(json).toMatchObject({
      mode: "commit",
      format: "long",
      rowsImported: 5,
      counts: { values: 5, resultsCreated: 3 },
    });
    const after = await tableCounts();
    expect(after.results - before.results).toBe(3);
    expect(after.uploads - before.uploads).toBe(1);
    expect(after.audit - before.audit).toBe(1);

    const rows = await resultsOf(sessionId);
    const find = (athlete: string, test: string) => rows.find((r) => r.athlete === athlete && r.test === test);
    expect(find("Jonah Pellegrini", "Countermovement jump")).toMatchObject({
      trials: [41.2, 42],
      value: 42,
      version: 1,
    });
    // A sprint's best trial is the fastest (direction "lower").
    expect(find("Callum Adeyemi", "10 m sprint")).toMatchObject({ trials: [1.82, 1.79], value: 1.79 });
    expect(find("Callum Adeyemi", "Countermovement jump")?.updatedBy).toBeGreaterThan(0);

    const [stored] = await env.db.select().from(uploads).where(eq(uploads.id, json.uploadId));
    expect(stored).toMatchObject({
      filename: "scores.csv",
      format: "long",
      rowsImported: 5,
      sessionId,
      sizeBytes: Buffer.byteLength(csv),
    });
    expect(Buffer.from(stored.content).toString("utf8")).toBe(csv);
    const [event] = await env.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.action, "results.import"), eq(auditEvents.entityId, json.uploadId)));
    expect(event).toMatchObject({
      entityType: "upload",
      sessionId,
      after: expect.objectContaining({ resultsCreated: 3, values: 5 }),
    });
  });

  it("re-importing the same file without replace=yes changes nothing and is not a conflict", async () => {
    await signInAs("coach@example.com");
    const sessionId = await newSession(ids.academy, "2026-12-03");
    expect((await upload(sessionId, csv)).status).toBe(200);
    const again = await upload(sessionId, csv);
    expect(again.status).toBe(200);
    expect(again.json.counts).toMatchObject({
      resultsCreated: 0,
      resultsUpdated: 0,
      resultsUnchanged: 3,
      trialsReplaced: 0,
    });
    expect((await resultsOf(sessionId)).every((r) => r.version === 1)).toBe(true);
  });
});

describe("wide format", () => {
  it("reads a ; file with a BOM, CRLF, decimal commas and the trial spellings", async () => {
    await signInAs("scientist@example.com");
    const sessionId = await newSession(ids.senior, "2026-12-04");
    const csv =
      "\uFEFFathlete;Countermovement jump 1;Countermovement jump #2;Countermovement jump (trial 3);10 m sprint;Position\r\n" +
      "NHW001;33,1;34,0;;1,91;GK\r\n" +
      '"Tessa Lindqvist";30,5;;31;1,88;DF\r\n';
    const preview = await upload(sessionId, csv, { mode: "preview" });
    expect(preview.status).toBe(200);
    expect(preview.json).toMatchObject({ format: "wide", delimiter: ";", decimalComma: true, errorCount: 0 });
    expect(preview.json.suggestions.map((s: any) => s.status)).toEqual([
      "athlete",
      "matched",
      "matched",
      "matched",
      "matched",
      "ignored",
    ]);

    const { status, json } = await upload(sessionId, csv);
    expect(status).toBe(200);
    expect(json.counts).toMatchObject({ values: 6, resultsCreated: 4 });
    const rows = await resultsOf(sessionId);
    expect(rows.find((r) => r.athlete === "Maren Oduya" && r.test === "Countermovement jump")).toMatchObject({
      trials: [33.1, 34],
      value: 34,
    });
    expect(rows.find((r) => r.athlete === "Tessa Lindqvist" && r.test === "Countermovement jump")).toMatchObject({
      trials: [30.5, null, 31],
      value: 31,
    });
    expect(rows.find((r) => r.athlete === "Tessa Lindqvist" && r.test === "10 m sprint")).toMatchObject({
      trials: [1.88],
      value: 1.88,
    });
  });

  it("takes the mapping chosen in the UI (format, athlete column, mapping JSON)", async () => {
    await signInAs("owner@example.com");
    const sessionId = await newSession(ids.senior, "2026-12-05");
    const csv = "Player,Jump A,Jump B,Gates\nMaren Oduya,35.5,36.1,ignored\n";
    const fields = {
      format: "wide",
      athleteColumn: "Player",
      mapping: JSON.stringify({
        "Jump A": { testId: testId["Countermovement jump"], trial: 1 },
        "Jump B": { testId: testId["Countermovement jump"], trial: 2 },
        Gates: null,
      }),
    };
    const { status, json } = await upload(sessionId, csv, { fields });
    expect(status).toBe(200);
    expect(json.counts.values).toBe(2);
    expect((await resultsOf(sessionId))[0]).toMatchObject({ athlete: "Maren Oduya", trials: [35.5, 36.1] });
  });
});

describe("bad files write nothing and say where the problem is", () => {
  let sessionId = 0;
  beforeAll(async () => {
    sessionId = await newSession(ids.academy, "2026-12-06");
  });

  const header = "athlete,test,trial,value";
  const cases: [string, string, number, number | null, string | undefined, RegExp][] = [
    [
      "a bad number",
      `${header}\nNHA001,Countermovement jump,1,41.2\nNHA002,Countermovement jump,1,forty`,
      422,
      3,
      "value",
      /not a number/,
    ],
    [
      "an unknown athlete",
      `${header}\nNHA001,Countermovement jump,1,41.2\nZed Unknown,Countermovement jump,1,40`,
      422,
      3,
      "athlete",
      /No athlete “Zed Unknown”/,
    ],
    [
      "an athlete of another squad",
      `${header}\nMaren Oduya,Countermovement jump,1,40`,
      422,
      2,
      "athlete",
      /Academy U18 roster/,
    ],
    ["an unknown test", `${header}\nNHA001,Broad jump,1,2.4`, 422, 2, "test", /No test in the Test library/],
    [
      "a duplicate row",
      `${header}\nNHA001,10 m sprint,1,1.8\nNHA002,10 m sprint,1,1.9\nNHA001,10 m sprint,1,1.7`,
      422,
      4,
      "trial",
      /Rows 2 and 4/,
    ],
    ["a trial beyond the test's trials", `${header}\nNHA001,Back squat 1RM,2,120`, 422, 2, "trial", /trials 1 to 1/],
    ["a wrong header (no athlete column)", "who;when\nNHA001;41", 422, 1, undefined, /No column names the athlete/],
    [
      "a wrong header (a column that is no test)",
      "name;score\nNHA001;41",
      422,
      1,
      "score",
      /No test in the Test library is called “score”/,
    ],
    ["a header only", header, 422, 2, undefined, /no data rows/],
    ["only empty scores", `${header}\nNHA001,Countermovement jump,1,`, 422, 2, undefined, /no scores/i],
    [
      "an unclosed quote",
      `${header}\nNHA001,"Countermovement jump,1,41\nNHA002,Countermovement jump,1,40`,
      422,
      2,
      undefined,
      /RFC 4180/,
    ],
  ];

  for (const [what, csv, status, row, column, message] of cases) {
    it(`${what} → ${status}, row ${row}`, async () => {
      await signInAs("coach@example.com");
      const before = await tableCounts();
      const answer = await upload(sessionId, csv);
      expect(answer.status).toBe(status);
      expect(answer.json.error.code).toBe("invalid_input");
      if (row !== null) expectRow(answer.json, row, column);
      expect(JSON.stringify(answer.json)).toMatch(message);
      expect(await tableCounts()).toEqual(before);
    });
  }

  it("lists the unknown athletes and tests with their rows", async () => {
    await signInAs("coach@example.com");
    const csv = `${header}\nGhost One,Countermovement jump,1,40\nGhost One,Countermovement jump,2,41\nNHA001,30 m sprint X,1,4.4`;
    const answer = await upload(sessionId, csv);
    expect(answer.json.error.details.unknownAthletes).toEqual([
      { value: "Ghost One", reason: "unknown", count: 2, rows: [2, 3], suggestions: [] },
    ]);
    expect(answer.json.error.details.unknownTests).toEqual([
      expect.objectContaining({ name: "30 m sprint X", reason: "unknown", count: 1, rows: [4] }),
    ]);
  });

  const fileCases: [string, () => Promise<{ status: number; json: any }>, number, RegExp][] = [
    ["an empty file", () => upload(sessionId, ""), 422, /empty/],
    [
      "a binary file (NUL bytes, e.g. an .xlsx zip)",
      () => upload(sessionId, new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 0x14, 0]), { filename: "scores.xlsx" }),
      415,
      /binary/,
    ],
    [
      "invalid UTF-8 (a Windows-1252 export)",
      () =>
        upload(
          sessionId,
          new Uint8Array([...Buffer.from("athlete,test,value\nJos"), 0xe9, ...Buffer.from(",CMJ,1\n")]),
        ),
      415,
      /UTF-8/,
    ],
    [
      "a file over 10 MB",
      () => upload(sessionId, new Uint8Array(10 * 1024 * 1024 + 1).fill(0x31)),
      413,
      /larger than 10 MB/,
    ],
    [
      "a body that says it is over 10 MB",
      () =>
        post(sessionId, "x", {
          headers: { "content-type": "multipart/form-data; boundary=abc", "content-length": String(11 * 1024 * 1024) },
        }),
      413,
      /larger than 10 MB/,
    ],
    [
      "a JSON body (not multipart)",
      () => post(sessionId, JSON.stringify({ file: "x" }), { headers: { "content-type": "application/json" } }),
      415,
      /multipart/,
    ],
    ["no body at all", () => post(sessionId, undefined), 415, /multipart/],
    [
      "broken multipart",
      () =>
        post(sessionId, "--abc\r\nnot a part", { headers: { "content-type": "multipart/form-data; boundary=abc" } }),
      400,
      /multipart/,
    ],
    [
      "no file field",
      () => {
        const f = new FormData();
        f.set("format", "long");
        return post(sessionId, f);
      },
      422,
      /Choose a CSV file/,
    ],
    [
      "file sent as text",
      () => {
        const f = new FormData();
        f.set("file", "athlete,test");
        return post(sessionId, f);
      },
      422,
      /file upload/,
    ],
    [
      "a bad mode",
      () => upload(sessionId, "athlete,test,value\n", { mode: "publish" as never }),
      422,
      /preview or commit/,
    ],
    [
      "bad mapping JSON",
      () => upload(sessionId, "athlete,x\nNHA001,1\n", { fields: { mapping: "{nope" } }),
      422,
      /not valid JSON/,
    ],
  ];
  for (const [what, send, status, message] of fileCases) {
    it(`${what} → ${status}`, async () => {
      await signInAs("coach@example.com");
      const before = await tableCounts();
      const answer = await send();
      expect(answer.status).toBe(status);
      expect(answer.json.error).toEqual(
        expect.objectContaining({ code: expect.any(String), message: expect.any(String) }),
      );
      expect(JSON.stringify(answer.json)).toMatch(message);
      expect(await tableCounts()).toEqual(before);
    });
  }

  it("a failure half-way through the commit rolls everything back (one transaction)", async () => {
    await signInAs("coach@example.com");
    const client = getClient();
    await client.execute(
      "CREATE TRIGGER fail_import BEFORE INSERT ON audit_events WHEN NEW.action = 'results.import' BEGIN SELECT RAISE(ABORT, 'test failure'); END",
    );
    const before = await tableCounts();
    const errors = vi.spyOn(console, "error").mockImplementation(() => undefined);
    try {
      const answer = await upload(sessionId, `${header}\nNHA001,Countermovement jump,1,41.2`);
      expect(answer.status).toBe(500);
      expect(answer.json.error.message).toMatch(/Nothing was changed/);
    } finally {
      errors.mockRestore();
      await client.execute("DROP TRIGGER fail_import");
    }
    expect(await tableCounts()).toEqual(before);
  });
});

describe("who may import", () => {
  const csv = "athlete,test,trial,value\nNHW001,Countermovement jump,1,33\n";

  it("a coach of another squad gets 404, the athlete 403, the other organisation 404, nobody 401", async () => {
    const before = await tableCounts();
    await signInAs("coach@example.com");
    expect((await upload(ids.seniorPost, csv)).status).toBe(404);
    await signInAs("athlete@example.com");
    const athlete = await upload(ids.seniorPost, csv);
    expect(athlete.status).toBe(403);
    expect(athlete.json.error.code).toBe("forbidden");
    await signInAs("owner@other.example.com");
    expect((await upload(ids.seniorPost, csv)).status).toBe(404);
    await signInAs(null);
    expect((await upload(ids.seniorPost, csv)).status).toBe(401);
    await signInAs("owner@example.com");
    expect((await upload(999999, csv)).status).toBe(404);
    expect((await upload("abc" as never, csv)).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
  });

  it("a coach cannot import into a published session of their own squad (403); a scientist can preview it", async () => {
    await signInAs("coach@example.com");
    const answer = await upload(ids.academyPre, "athlete,test,trial,value\nNHA001,Countermovement jump,1,40\n", {
      mode: "preview",
    });
    expect(answer.status).toBe(403);
    await signInAs("scientist@example.com");
    expect(
      (
        await upload(ids.academyPre, "athlete,test,trial,value\nNHA001,Countermovement jump,1,40\n", {
          mode: "preview",
        })
      ).status,
    ).toBe(200);
  });
});

describe("existing results are never overwritten silently", () => {
  it("a commit that would replace stored values answers 409, lists them and writes nothing; replace=yes writes and bumps versions", async () => {
    await signInAs("coach@example.com");
    const [stored] = await env.db
      .select({
        athleteId: results.athleteId,
        trials: results.trials,
        version: results.version,
        externalId: athletes.externalId,
      })
      .from(results)
      .innerJoin(athletes, eq(athletes.id, results.athleteId))
      .where(
        and(
          eq(results.sessionId, ids.academyPost),
          eq(results.testId, testId["Countermovement jump"]),
          eq(athletes.externalId, "NHA001"),
        ),
      );
    const csv = `athlete,test,trial,value\nNHA001,Countermovement jump,1,${stored.trials[0]! + 1}\nNHA001,Countermovement jump,2,${stored.trials[1]}\n`;

    const preview = await upload(ids.academyPost, csv, { mode: "preview" });
    expect(preview.json.counts).toMatchObject({ resultsUpdated: 1, trialsReplaced: 1 });
    expect(preview.json.replacements[0]).toMatchObject({
      row: 2,
      trial: 1,
      previous: stored.trials[0],
      next: stored.trials[0]! + 1,
    });

    const before = await tableCounts();
    const refused = await upload(ids.academyPost, csv);
    expect(refused.status).toBe(409);
    expect(refused.json.error.code).toBe("conflict");
    expect(refused.json.error.rows[0]).toMatchObject({
      row: 2,
      column: "trial",
      message: expect.stringMatching(/Replaces Jonah Pellegrini's Countermovement jump trial 1/),
    });
    expect(await tableCounts()).toEqual(before);

    const replaced = await upload(ids.academyPost, csv, { fields: { replace: "yes" } });
    expect(replaced.status).toBe(200);
    expect(replaced.json.counts).toMatchObject({ resultsUpdated: 1, trialsReplaced: 1 });
    const [now] = await env.db
      .select({ trials: results.trials, value: results.value, version: results.version })
      .from(results)
      .where(
        and(
          eq(results.sessionId, ids.academyPost),
          eq(results.testId, testId["Countermovement jump"]),
          eq(results.athleteId, stored.athleteId),
        ),
      );
    expect(now.trials).toEqual([stored.trials[0]! + 1, ...stored.trials.slice(1)]);
    expect(now.value).toBe(Math.max(...(now.trials.filter((t) => t !== null) as number[])));
    expect(now.version).toBe(stored.version + 1);
  });

  it("after an import, a Session sheet save carrying the old version gets 409", async () => {
    const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
    await signInAs("coach@example.com");
    const [stored] = await env.db
      .select({ athleteId: results.athleteId, trials: results.trials, version: results.version })
      .from(results)
      .innerJoin(athletes, eq(athletes.id, results.athleteId))
      .where(
        and(
          eq(results.sessionId, ids.academyPost),
          eq(results.testId, testId["10 m sprint"]),
          eq(athletes.externalId, "NHA002"),
        ),
      );
    const staleVersion = stored.version;
    const imported = await upload(ids.academyPost, `athlete,test,trial,value\nNHA002,10 m sprint,1,1.77\n`, {
      fields: { replace: "yes" },
    });
    expect(imported.status).toBe(200);
    const save = await call(resultsRoute.PUT, {
      method: "PUT",
      params: { sessionId: String(ids.academyPost) },
      body: {
        results: [
          {
            athleteId: stored.athleteId,
            testId: testId["10 m sprint"],
            trials: [1.8, 1.81],
            flag: null,
            note: null,
            version: staleVersion,
          },
        ],
      },
    });
    expect(save.status).toBe(409);
  });
});
