/**
 * The Reliability check of a two-trial file, `POST /api/reports/reliability/file`, and adopting
 * the typical error it measures. The file is Bland & Altman's (1986) Wright peak-flow meter,
 * first and second readings of 17 people; the expected figures are METHODS.md §3.5's check set B.
 */
import { eq } from "drizzle-orm";
import jstatPkg from "jstat";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { reliabilityStudies, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const jStat = ((jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg) as typeof jstatPkg;
const route = await import("@/app/api/reports/reliability/file/route");
const adoptRoute = await import("@/app/api/tests/[testId]/typical-error/route");

// Bland & Altman (1986), Lancet i:307–310, Wright meter readings (l/min), METHODS.md §3.5.
const WRIGHT_1 = [494, 395, 516, 434, 476, 557, 413, 442, 650, 433, 417, 656, 267, 478, 178, 423, 427];
const WRIGHT_2 = [490, 397, 512, 401, 470, 611, 415, 431, 638, 429, 420, 633, 275, 492, 165, 372, 421];
const wrightFile = [
  "subject;first reading;second reading",
  ...WRIGHT_1.map((a, i) => `P${i + 1};${a};${WRIGHT_2[i]}`),
].join("\r\n");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let cmj = 0;
beforeAll(async () => {
  env = await setupTestDatabase();
  cmj = (await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "Countermovement jump")))[0].id;
});
afterAll(() => env.cleanup());

const check = (body: Record<string, unknown>) =>
  call(route.POST, { method: "POST", body: { testId: cmj, confidence: 0.95, fileName: "wright.csv", ...body } });
const near = (actual: number, expected: number, dp: number) =>
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(0.5 * 10 ** -dp + 1e-12);

describe("POST /api/reports/reliability/file", () => {
  it("gives METHODS.md §3.5's typical error, CV, ICCs and change in mean for the Wright meter", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await check({ csv: wrightFile });
    expect(status).toBe(200);
    expect(json.file).toEqual({ name: "wright.csv", rows: 17 });
    expect(json.sessions).toBeNull();
    expect(json.n).toBe(17);
    expect(json.df).toBe(16);
    near(json.typicalError, 15.3612, 4);
    near(json.typicalErrorLower, 11.4406, 4);
    near(json.typicalErrorUpper, 23.3787, 4);
    near(json.cvPercent, 3.5118, 4);
    near(json.changeInMean, -4.9412, 4);
    near(json.icc31, 0.983, 4);
    near(json.icc31Lower, 0.9539, 4);
    near(json.icc31Upper, 0.9938, 4);
    near(json.icc21, 0.9832, 4);
    near(json.icc21Lower, 0.9552, 4);
    near(json.icc21Upper, 0.9938, 4);
    // Change in mean's t-interval, from jStat's t quantile: −4.9412 ± t(16) · 21.7240 / √17.
    const half = jStat.studentt.inv(0.975, 16) * (21.724 / Math.sqrt(17));
    near(json.changeLower, -4.9412 - half, 3);
    near(json.changeUpper, -4.9412 + half, 3);
    expect(json.pairs[0]).toEqual({ athleteId: 2, name: "P1", first: 494, second: 490 });
  });

  it("lists rows with one reading as left out, by their label", async () => {
    await signInAs("owner@example.com");
    const { status, json } = await check({ csv: `${wrightFile}\r\nP18;401;\r\nP19;;388` });
    expect(status).toBe(200);
    expect(json.n).toBe(17);
    expect(json.excluded).toEqual([
      { athleteId: 19, name: "P18", reason: "no-post", flag: null },
      { athleteId: 20, name: "P19", reason: "no-pre", flag: null },
    ]);
  });

  it("answers 422 naming the row and column of a cell that is not a number", async () => {
    await signInAs("owner@example.com");
    const { status, json } = await check({ csv: "athlete,t1,t2\nA,41.2,40.8\nB,39.9 cm,40.1\nC,38.0,38.4" });
    expect(status).toBe(422);
    expect(json.error.message).toBe("One score is not a number.");
    expect(json.error.rows).toEqual([{ row: 3, column: "t1", message: expect.stringContaining("39.9 cm") }]);
  });

  it("answers 422 for a file that cannot make a study, and for bad settings", async () => {
    await signInAs("owner@example.com");
    for (const body of [
      { csv: "athlete,t1,t2\nA,41.2,40.8" },
      { csv: "a,b,c,d\n1,2,3,4" },
      { csv: "" },
      { csv: "x".repeat(200_001) },
      { csv: wrightFile, confidence: 0.8 },
      { csv: wrightFile, fileName: "" },
      { csv: wrightFile, testId: "1" },
    ]) {
      const { status, json } = await check(body);
      expect(status, JSON.stringify(body).slice(0, 80)).toBe(422);
      expect(json.error.message.length).toBeGreaterThan(5);
    }
  });

  it("answers 404 for a test outside the organisation and 403 for coaches and athletes", async () => {
    await signInAs("owner@other.example.com");
    expect((await check({ csv: wrightFile })).status).toBe(404);
    await signInAs("coach@example.com");
    expect((await check({ csv: wrightFile })).status).toBe(403);
    await signInAs("athlete@example.com");
    expect((await check({ csv: wrightFile })).status).toBe(403);
  });
});

describe("POST /api/tests/[testId]/typical-error with a file", () => {
  it("adopts the file's typical error with its df and a source naming the file", async () => {
    await signInAs("scientist@example.com");
    const [before] = await env.db.select().from(tests).where(eq(tests.id, cmj));
    const { status, json } = await call(adoptRoute.POST, {
      method: "POST",
      params: { testId: `${cmj}` },
      body: { fileName: "wright.csv", csv: wrightFile },
    });
    expect(status).toBe(200);
    expect(json.test.version).toBe(before.version + 1);
    near(json.test.typicalError, 15.3612, 4);
    expect(json.test.typicalErrorDf).toBe(16);
    expect(json.test.typicalErrorSource).toMatch(/^Measured: file “wright\.csv”, adopted \d{1,2} \w{3} \d{4}, n = 17$/);
    const [study] = await env.db.select().from(reliabilityStudies).where(eq(reliabilityStudies.testId, cmj));
    expect(study).toMatchObject({ firstSessionId: null, secondSessionId: null, n: 17, typicalErrorDf: 16 });
  });

  it("changes nothing when the file cannot make a study", async () => {
    await signInAs("scientist@example.com");
    const [before] = await env.db.select().from(tests).where(eq(tests.id, cmj));
    const { status } = await call(adoptRoute.POST, {
      method: "POST",
      params: { testId: `${cmj}` },
      body: { fileName: "bad.csv", csv: "athlete,t1,t2\nA,1,x" },
    });
    expect(status).toBe(422);
    const [after] = await env.db.select().from(tests).where(eq(tests.id, cmj));
    expect(after).toEqual(before);
  });
});
