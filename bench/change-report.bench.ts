/**
 * change-report-p95-ms: p95 of GET /api/reports/change for a 40-athlete squad, over HTTP against
 * the production server, on a database holding 1 000 000 results (2 500 sessions × 40 athletes ×
 * 10 tests). The database is built once into bench/.cache/ and reused by later runs.
 */
import { existsSync, mkdirSync, renameSync, rmSync } from "node:fs";
import { join } from "node:path";
import { openDatabase } from "../db/connection";
import { migrateDatabase } from "../db/migrate";
import { hashPassword } from "../lib/auth/password";
import { HttpSession } from "../tests/helpers/http";
import { startProductionServer } from "../tests/helpers/server";
import type { BenchResult } from "./harness";

const ATHLETES = 40;
const TESTS = 10;
const SESSIONS = 2500;
const REQUESTS = 200;
const CACHE = join(process.cwd(), "bench", ".cache");
const FILE = join(CACHE, `change-report-${SESSIONS * ATHLETES * TESTS}.db`);
const EMAIL = "bench-scientist@example.com";
const PASSWORD = "bench-password-1";

/** One club, one squad of 40, ten tests, 2 500 dated sessions each measuring all ten: 1 000 000 results. */
async function build(path: string) {
  const url = `file:${path}`;
  await migrateDatabase(url);
  const { client } = openDatabase(url);
  try {
    const hash = await hashPassword(PASSWORD, 4);
    await client.batch(
      [
        "INSERT INTO organizations (id, name) VALUES (1, 'Bench club')",
        {
          sql: "INSERT INTO users (id, email, name, password_hash) VALUES (1, ?, 'Bench scientist', ?)",
          args: [EMAIL, hash],
        },
        "INSERT INTO memberships (user_id, organization_id, role) VALUES (1, 1, 'scientist')",
        "INSERT INTO squads (id, organization_id, name) VALUES (1, 1, 'Bench squad')",
        `WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < ${ATHLETES})
         INSERT INTO athletes (id, organization_id, name) SELECT i, 1, 'Athlete ' || printf('%02d', i) FROM n`,
        "INSERT INTO squad_athletes (squad_id, athlete_id) SELECT 1, id FROM athletes",
        `WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < ${TESTS})
         INSERT INTO tests (id, organization_id, name, unit, direction) SELECT i, 1, 'Test ' || i, 'cm', 'higher' FROM n`,
        `WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < ${SESSIONS})
         INSERT INTO testing_sessions (id, organization_id, squad_id, date, phase)
         SELECT i, 1, 1, date('2000-01-01', '+' || (i * 3) || ' days'), 'in-season' FROM n`,
        "INSERT INTO session_tests (session_id, test_id, position) SELECT s.id, t.id, t.id FROM testing_sessions s CROSS JOIN tests t",
        `INSERT INTO results (organization_id, session_id, athlete_id, test_id, trials, value)
         SELECT 1, s.id, a.id, t.id, '[]', 30 + ((s.id * 7 + a.id * 13 + t.id * 17) % 100) / 10.0
         FROM testing_sessions s CROSS JOIN athletes a CROSS JOIN tests t`,
      ],
      "write",
    );
  } finally {
    client.close();
  }
  // The file is renamed into place when done: its write-ahead log must be folded in first,
  // on a connection of its own once the builder's are closed.
  const { client: last } = openDatabase(url);
  try {
    await last.execute("PRAGMA wal_checkpoint(TRUNCATE)");
  } finally {
    last.close();
  }
}

const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.ceil(p * sorted.length) - 1)];

export default async function changeReport(): Promise<BenchResult[]> {
  mkdirSync(CACHE, { recursive: true });
  if (!existsSync(FILE)) {
    const partial = `${FILE}.building`;
    for (const leftover of [partial, `${partial}-wal`, `${partial}-shm`]) rmSync(leftover, { force: true });
    await build(partial);
    renameSync(partial, FILE);
    for (const leftover of [`${partial}-wal`, `${partial}-shm`]) rmSync(leftover, { force: true });
  }
  const server = await startProductionServer({ databaseUrl: `file:${FILE}` });
  try {
    const http = new HttpSession(server.baseUrl);
    await http.signIn(EMAIL, PASSWORD);
    const path = `/api/reports/change?testId=5&fromSessionId=${SESSIONS - 1}&toSessionId=${SESSIONS}&confidence=0.9`;
    const first = await http.json(path);
    if (first.status !== 200 || first.json.squad.n !== ATHLETES) throw new Error(`unexpected answer ${first.status}`);
    for (let i = 0; i < 20; i++) await http.json(path);
    const times: number[] = [];
    for (let i = 0; i < REQUESTS; i++) {
      const started = performance.now();
      const { status } = await http.json(path);
      times.push(performance.now() - started);
      if (status !== 200) throw new Error(`status ${status}`);
    }
    times.sort((a, b) => a - b);
    return [
      {
        name: "change-report-p95-ms",
        value: Number(percentile(times, 0.95).toFixed(2)),
        unit: "ms",
        target: 50,
        detail: `GET /api/reports/change, ${ATHLETES} athletes, 1 000 000 results in the database; p50 ${percentile(times, 0.5).toFixed(2)} ms over ${REQUESTS} sequential requests`,
      },
    ];
  } finally {
    await server.stop();
  }
}
