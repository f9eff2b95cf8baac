/**
 * Benchmark for the CSV import (lib/import + lib/data/import).
 *
 * - import-100k-s: a generated 102 000-row long-format file (2 000 athletes × 17 tests × 3 trials)
 *   decoded, parsed, checked against roster and battery, and committed (results, raw upload,
 *   audit event, one transaction) through runImport — the code the route handler calls.
 * - import-100k-ratio: that time ÷ a bare batched INSERT of the same 34 000 result rows through
 *   the same libSQL client (same settings) into a fresh identical database. Target ≤ 2.
 *
 * Each round builds two fresh SQLite files; the median of the rounds is reported.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Client } from "@libsql/client";
import { getClient } from "../db/client";
import { enableWriteAheadLog, openDatabase } from "../db/connection";
import { migrateDatabase } from "../db/migrate";
import * as s from "../db/schema";
import { loadActor } from "../lib/data/actors";
import { runImport } from "../lib/data/import";
import { reduceTrials } from "../lib/trials";
import { importOptionsSchema } from "../lib/validation/import";
import { type BenchResult, seededRandom } from "./harness";

const ATHLETES = 2000;
const TESTS = 17;
const TRIALS = 3;
const ROUNDS = 3;

type Fixture = {
  url: string;
  sessionId: number;
  userId: number;
  organizationId: number;
  athleteIds: number[];
  testIds: number[];
};

/** The same club in every database: one squad of 2 000 athletes, 17 tests, one session with all of them. */
export async function buildDatabase(url: string): Promise<Fixture> {
  await migrateDatabase(url);
  const { client, db } = openDatabase(url);
  try {
    const [org] = await db.insert(s.organizations).values({ name: "Bench club" }).returning({ id: s.organizations.id });
    const [user] = await db
      .insert(s.users)
      .values({ email: "bench@example.com", name: "Bench scientist" })
      .returning({ id: s.users.id });
    await db.insert(s.memberships).values({ userId: user.id, organizationId: org.id, role: "scientist" });
    const [squad] = await db
      .insert(s.squads)
      .values({ organizationId: org.id, name: "Bench squad" })
      .returning({ id: s.squads.id });
    const athleteIds: number[] = [];
    for (let i = 0; i < ATHLETES; i += 500) {
      const chunk = Array.from({ length: Math.min(500, ATHLETES - i) }, (_, k) => ({
        organizationId: org.id,
        name: `Athlete ${String(i + k + 1).padStart(4, "0")}`,
        externalId: `B${String(i + k + 1).padStart(5, "0")}`,
      }));
      athleteIds.push(...(await db.insert(s.athletes).values(chunk).returning({ id: s.athletes.id })).map((r) => r.id));
    }
    for (let i = 0; i < athleteIds.length; i += 500) {
      await db
        .insert(s.squadAthletes)
        .values(athleteIds.slice(i, i + 500).map((athleteId) => ({ squadId: squad.id, athleteId })));
    }
    const testRows = await db
      .insert(s.tests)
      .values(
        Array.from({ length: TESTS }, (_, t) => ({
          organizationId: org.id,
          name: `Bench test ${t + 1}`,
          unit: "cm",
          direction: t % 2 ? ("lower" as const) : ("higher" as const),
          trialRule: t % 3 ? ("best" as const) : ("mean" as const),
          trialsPerSession: TRIALS,
        })),
      )
      .returning({ id: s.tests.id });
    const [session] = await db
      .insert(s.testingSessions)
      .values({ organizationId: org.id, squadId: squad.id, date: "2026-09-01", phase: "pre-block" })
      .returning({ id: s.testingSessions.id });
    await db
      .insert(s.sessionTests)
      .values(testRows.map((t, position) => ({ sessionId: session.id, testId: t.id, position })));
    return {
      url,
      sessionId: session.id,
      userId: user.id,
      organizationId: org.id,
      athleteIds,
      testIds: testRows.map((t) => t.id),
    };
  } finally {
    client.close();
  }
}

/** Scores for every athlete × test × trial, two decimals, and the CSV that carries them. */
export function generate() {
  const random = seededRandom(20261101);
  const scores = new Float64Array(ATHLETES * TESTS * TRIALS);
  for (let i = 0; i < scores.length; i++) scores[i] = Math.round((20 + 40 * random()) * 100) / 100;
  const lines = ["athlete,test,trial,value"];
  for (let a = 0; a < ATHLETES; a++) {
    const athlete = `B${String(a + 1).padStart(5, "0")}`;
    for (let t = 0; t < TESTS; t++) {
      for (let k = 0; k < TRIALS; k++)
        lines.push(`${athlete},Bench test ${t + 1},${k + 1},${scores[(a * TESTS + t) * TRIALS + k]}`);
    }
  }
  return { scores, csv: `${lines.join("\n")}\n` };
}

async function timeImport(fixture: Fixture, bytes: Uint8Array): Promise<number> {
  process.env.DATABASE_URL = fixture.url;
  const actor = (await loadActor(fixture.userId))!;
  const options = importOptionsSchema.parse({ mode: "commit" });
  const started = process.hrtime.bigint();
  const answer = await runImport(
    actor,
    fixture.sessionId,
    { bytes, filename: "bench.csv", contentType: "text/csv" },
    options,
  );
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  if (answer.mode !== "commit" || answer.counts.resultsCreated !== ATHLETES * TESTS)
    throw new Error("The import did not write every result.");
  getClient().close();
  return seconds;
}

/** The least work that stores the same result rows: multi-row INSERTs in one transaction. */
async function timeBareInsert(fixture: Fixture, scores: Float64Array): Promise<number> {
  const { client } = openDatabase(fixture.url);
  await enableWriteAheadLog(client, fixture.url);
  const rules = Array.from({ length: TESTS }, (_, t) => ({
    rule: t % 3 ? ("best" as const) : ("mean" as const),
    direction: t % 2 ? ("lower" as const) : ("higher" as const),
  }));
  const started = process.hrtime.bigint();
  const now = Date.now();
  const columns =
    "(organization_id, session_id, athlete_id, test_id, trials, value, flag, updated_by, updated_at, version)";
  const batch = 3000;
  const tx = await client.transaction("write");
  try {
    const total = ATHLETES * TESTS;
    for (let start = 0; start < total; start += batch) {
      const end = Math.min(total, start + batch);
      const args: (number | string | null)[] = [];
      for (let r = start; r < end; r++) {
        const a = Math.floor(r / TESTS);
        const t = r % TESTS;
        const base = r * TRIALS;
        const trials = [scores[base], scores[base + 1], scores[base + 2]];
        args.push(
          fixture.organizationId,
          fixture.sessionId,
          fixture.athleteIds[a],
          fixture.testIds[t],
          JSON.stringify(trials),
          reduceTrials(trials, rules[t].rule, rules[t].direction),
          null,
          fixture.userId,
          now,
          1,
        );
      }
      const placeholders = new Array(end - start).fill("(?, ?, ?, ?, ?, ?, ?, ?, ?, ?)").join(", ");
      await tx.execute({ sql: `INSERT INTO results ${columns} VALUES ${placeholders}`, args });
    }
    await tx.commit();
  } finally {
    tx.close();
  }
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  await checkCount(client, ATHLETES * TESTS);
  client.close();
  return seconds;
}

async function checkCount(client: Client, expected: number) {
  const { rows } = await client.execute("SELECT count(*) AS n FROM results");
  if (Number(rows[0].n) !== expected) throw new Error(`Bare insert wrote ${rows[0].n} rows, expected ${expected}.`);
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[values.length >> 1];

export default async function importBench(): Promise<BenchResult[]> {
  const previousUrl = process.env.DATABASE_URL;
  const dir = mkdtempSync(join(tmpdir(), "changewise-bench-import-"));
  try {
    const { scores, csv } = generate();
    const bytes = new TextEncoder().encode(csv);
    const importTimes: number[] = [];
    const bareTimes: number[] = [];
    const ratios: number[] = [];
    // Round 0 warms up the JIT and the page cache and is not counted.
    for (let round = 0; round <= ROUNDS; round++) {
      const a = await buildDatabase(`file:${join(dir, `import-${round}.db`)}`);
      const b = await buildDatabase(`file:${join(dir, `bare-${round}.db`)}`);
      // Alternate the order so neither side always runs on a warmer machine.
      let importS: number;
      let bareS: number;
      if (round % 2) {
        bareS = await timeBareInsert(b, scores);
        importS = await timeImport(a, bytes);
      } else {
        importS = await timeImport(a, bytes);
        bareS = await timeBareInsert(b, scores);
      }
      if (round === 0) continue;
      importTimes.push(importS);
      bareTimes.push(bareS);
      ratios.push(importS / bareS);
    }
    const rows = ATHLETES * TESTS * TRIALS;
    const sizeMb = (bytes.length / 1024 / 1024).toFixed(1);
    return [
      {
        name: "import-100k-ratio",
        value: median(ratios),
        unit: "×",
        baseline: median(bareTimes),
        baselineUnit: "s",
        ratio: median(ratios),
        target: 2,
        detail: `${rows} CSV rows (${sizeMb} MB) → ${ATHLETES * TESTS} results: runImport ÷ bare batched INSERT, median of ${ROUNDS} rounds`,
      },
      {
        name: "import-100k-s",
        value: median(importTimes),
        unit: "s",
        detail: `decode + parse + check + commit of ${rows} rows (${sizeMb} MB), median of ${ROUNDS} rounds`,
      },
    ];
  } finally {
    if (previousUrl === undefined) delete process.env.DATABASE_URL;
    else process.env.DATABASE_URL = previousUrl;
    rmSync(dir, { recursive: true, force: true });
  }
}
