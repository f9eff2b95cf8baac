/**
 * A real crash in the middle of an import: a child process commits a 102 000-row CSV through
 * runImport and is killed with SIGKILL while its write transaction is open (frozen at a chosen
 * statement, or at a time after the transaction opened). Reopened, the database must pass
 * `PRAGMA integrity_check` and hold either everything it held before or the whole import —
 * never part of it.
 */
import { spawn } from "node:child_process";
import { copyFileSync, existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { type Client, createClient } from "@libsql/client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildDatabase, generate } from "@/bench/import.bench";
import { getClient } from "@/db/client";
import { loadActor } from "@/lib/data/actors";
import { runImport } from "@/lib/data/import";
import { importOptionsSchema } from "@/lib/validation/import";
import { resultsChecksum } from "../helpers/db-state";

type Kill = { label: string; pause?: string; afterOpenMs?: number };
const KILLS: Kill[] = [
  { label: "after BEGIN and the first read", pause: "statement:1" },
  { label: "in the middle of the result batches", pause: "statement:5" },
  { label: "just before COMMIT", pause: "commit" },
  { label: "300 ms after the transaction opened", afterOpenMs: 300 },
  { label: "900 ms after the transaction opened", afterOpenMs: 900 },
];

let dir = "";
let base = "";
let csvPath = "";
let fixture: Awaited<ReturnType<typeof buildDatabase>>;
let before = "";
let full = "";

/** Results checksum plus the upload and audit rows the same transaction writes. */
async function state(client: Client): Promise<string> {
  const count = async (table: string) => Number((await client.execute(`SELECT count(*) FROM ${table}`)).rows[0][0]);
  return `${await resultsChecksum(client)}|uploads ${await count("uploads")}|audit ${await count("audit_events")}`;
}

async function importInProcess(url: string, csv: string) {
  process.env.DATABASE_URL = url;
  const actor = (await loadActor(fixture.userId))!;
  const options = importOptionsSchema.parse({ mode: "commit", replace: "yes" });
  await runImport(
    actor,
    fixture.sessionId,
    { bytes: new TextEncoder().encode(csv), filename: "setup.csv", contentType: "text/csv" },
    options,
  );
  getClient().close();
}

/** A copy of a database no one has open: the main file and, if one is left, its write-ahead log. */
function copyClosed(from: string, to: string) {
  copyFileSync(from, to);
  if (existsSync(`${from}-wal`)) copyFileSync(`${from}-wal`, `${to}-wal`);
}

async function inspect(path: string) {
  const client = createClient({ url: `file:${path}` });
  try {
    const integrity = String((await client.execute("PRAGMA integrity_check")).rows[0][0]);
    return { integrity, state: await state(client) };
  } finally {
    client.close();
  }
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "changewise-crash-"));
  base = join(dir, "base.db");
  fixture = await buildDatabase(`file:${base}`);
  const { csv } = generate();
  csvPath = join(dir, "full.csv");
  writeFileSync(csvPath, csv);
  // Some results already stored, so "before" is not simply empty: the first 1 000 athletes' worth
  // of rows, one unit off, which the full import then replaces.
  const lines = csv.trimEnd().split("\n");
  const partial = [
    lines[0],
    ...lines
      .slice(1, 1 + 1000 * 17 * 3)
      .map((l) => l.replace(/,([\d.]+)$/, (_, v) => `,${(Number(v) + 1).toFixed(2)}`)),
  ];
  await importInProcess(`file:${base}`, `${partial.join("\n")}\n`);
  before = (await inspect(base)).state;
  copyClosed(base, join(dir, "reference.db"));
  await importInProcess(`file:${join(dir, "reference.db")}`, csv);
  full = (await inspect(join(dir, "reference.db"))).state;
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Runs the child on a copy of the base and kills it as `kill` says; what did it print? */
function runAndKill(path: string, kill: Kill): Promise<{ lines: string[]; killed: boolean }> {
  return new Promise((resolve, reject) => {
    // node itself with tsx as a loader, not the tsx command: that one runs the script in a child
    // of its own, which a SIGKILL to the command would leave running with the database open.
    const args = [
      "--conditions=react-server",
      "--import",
      "tsx",
      "tests/helpers/crash-import.ts",
      `file:${path}`,
      `${fixture.userId}`,
      `${fixture.sessionId}`,
      csvPath,
      kill.pause ?? "",
    ];
    const child = spawn(process.execPath, args, { stdio: ["ignore", "pipe", "pipe"] });
    const lines: string[] = [];
    let killed = false;
    let stderr = "";
    const killNow = () => {
      if (child.exitCode === null && !killed) {
        killed = child.kill("SIGKILL");
      }
    };
    let buffer = "";
    child.stdout.on("data", (chunk: Buffer) => {
      buffer += chunk.toString();
      const parts = buffer.split("\n");
      buffer = parts.pop() ?? "";
      for (const line of parts) {
        lines.push(line);
        if (kill.pause && line === "paused") killNow();
        if (kill.afterOpenMs !== undefined && line === "transaction open") setTimeout(killNow, kill.afterOpenMs);
      }
    });
    child.stderr.on("data", (chunk: Buffer) => (stderr += chunk.toString()));
    child.on("error", reject);
    child.on("exit", (code, signal) => {
      if (signal !== "SIGKILL" && code !== 0)
        reject(new Error(`import child failed (${code}): ${stderr.slice(0, 500)}`));
      else resolve({ lines, killed: signal === "SIGKILL" });
    });
  });
}

describe("a process killed in the middle of an import", () => {
  it("leaves all of the import or none of it, and an intact database, every time", async () => {
    expect(full).not.toBe(before);
    const outcomes = { killed: 0, rolledBack: 0, complete: 0, partial: 0, notIntact: 0 };
    for (const [i, kill] of KILLS.entries()) {
      const path = join(dir, `run-${i}.db`);
      copyClosed(base, path);
      const { lines, killed } = await runAndKill(path, kill);
      expect(lines).toContain("committing");
      if (kill.pause) {
        // The kill really landed inside the open transaction.
        expect([killed, lines.includes("transaction open"), lines.includes("committed")]).toEqual([true, true, false]);
      }
      if (killed) outcomes.killed++;
      const { integrity, state: after } = await inspect(path);
      if (integrity !== "ok") outcomes.notIntact++;
      if (after === before) outcomes.rolledBack++;
      else if (after === full) outcomes.complete++;
      else outcomes.partial++;
      console.log(
        `  kill ${kill.label}: ${killed ? "killed" : "finished first"} after "${lines.at(-1)}" → ${after === before ? "nothing imported" : after === full ? "whole import" : "PARTIAL"}, integrity ${integrity}`,
      );
    }
    console.log(
      `crash during import: ${KILLS.length} runs, ${outcomes.killed} killed with SIGKILL, ${outcomes.rolledBack} rolled back, ${outcomes.complete} complete, ${outcomes.partial} partial, integrity ok ${KILLS.length - outcomes.notIntact}/${KILLS.length}`,
    );
    expect(outcomes.partial).toBe(0);
    expect(outcomes.notIntact).toBe(0);
    // Every kill at a pause point is inside the transaction: those must all have rolled back.
    expect(outcomes.rolledBack).toBeGreaterThanOrEqual(KILLS.filter((k) => k.pause).length);
  }, 120_000);
});
