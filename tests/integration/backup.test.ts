/**
 * Backups (scripts/backup.ts) and restores (scripts/restore.ts): a backup taken while another
 * process keeps writing is one consistent instant of the database; restored into a fresh path
 * it holds exactly what the backup holds. A damaged file, a database still in use and a libSQL
 * server URL are refused without touching anything.
 */
import { type ChildProcessWithoutNullStreams, spawn } from "node:child_process";
import {
  closeSync,
  copyFileSync,
  existsSync,
  mkdtempSync,
  openSync,
  readFileSync,
  rmSync,
  writeFileSync,
  writeSync,
} from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createClient } from "@libsql/client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import { backupDatabase } from "@/scripts/backup";
import { restoreDatabase } from "@/scripts/restore";
import { setupTestDatabase } from "../helpers/db";
import { tableHashes } from "../helpers/db-state";

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let dir = "";
let sessionId = 0;

beforeAll(async () => {
  env = await setupTestDatabase();
  dir = mkdtempSync(join(tmpdir(), "changewise-backup-"));
  const { rows } = await getClient().execute(
    "SELECT session_id FROM results GROUP BY session_id ORDER BY count(*) DESC LIMIT 1",
  );
  sessionId = Number(rows[0][0]);
  // A season of raw uploads (24 MB), so copying takes long enough for the writer to get in.
  for (let i = 0; i < 6; i++) {
    await getClient().execute({
      sql: "INSERT INTO uploads (organization_id, session_id, filename, size_bytes, content) VALUES (1, ?, ?, ?, randomblob(?))",
      args: [sessionId, `season-${i}.csv`, 4 << 20, 4 << 20],
    });
  }
});

const writerCommits = async () =>
  Number((await getClient().execute("SELECT count(*) FROM audit_events WHERE after LIKE '%busy-writer%'")).rows[0][0]);
afterAll(() => {
  env.cleanup();
  rmSync(dir, { recursive: true, force: true });
});

const hashesOf = async (path: string) => {
  const client = createClient({ url: `file:${path}` });
  try {
    return await tableHashes(client);
  } finally {
    client.close();
  }
};

/** Starts the busy writer and resolves once it has committed `atLeast` transactions. */
function startWriter(atLeast: number): Promise<{ child: ChildProcessWithoutNullStreams; stop: () => Promise<number> }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["tests/helpers/busy-writer.mjs", env.url, String(sessionId)]);
    let written = 0;
    let stopped: (n: number) => void = () => undefined;
    let started = false;
    child.stdout.on("data", (chunk: Buffer) => {
      for (const line of chunk.toString().split("\n")) {
        const wrote = /^wrote (\d+)$/.exec(line);
        if (wrote) written = Number(wrote[1]);
        const end = /^stopped (\d+)$/.exec(line);
        if (end) stopped(Number(end[1]));
      }
      if (!started && written >= atLeast) {
        started = true;
        resolve({
          child,
          stop: () =>
            new Promise<number>((done) => {
              stopped = done;
              child.stdin.write("stop\n");
            }),
        });
      }
    });
    let stderr = "";
    child.stderr.on("data", (chunk: Buffer) => (stderr += chunk.toString()));
    child.on("exit", (code) => {
      if (!started) reject(new Error(`busy writer exited early (${code}): ${stderr}`));
    });
  });
}

describe("backup while writing, restore into a fresh path", () => {
  it("the backup is one consistent instant and the restored database holds exactly what it holds", async () => {
    const live = env.url.slice("file:".length);
    const writer = await startWriter(20);
    const writtenBefore = await writerCommits();
    const backup = await backupDatabase({ url: env.url, dir: join(dir, "backups") });
    const writtenAfter = await writerCommits();
    // Let the writer go on after the copy, so the live database moves past it.
    await new Promise((r) => setTimeout(r, 200));
    const total = await writer.stop();
    expect(backup.integrity).toBe("ok");
    expect(backup.path).toMatch(/changewise-\d{8}-\d{6}\.db$/);

    const restoredPath = join(dir, "fresh", "restored.db");
    const restored = await restoreDatabase(backup.path, { url: `file:${restoredPath}` });
    expect(restored).toEqual({ path: restoredPath, previous: null });
    expect(await hashesOf(restoredPath)).toEqual(await hashesOf(backup.path));

    // One instant: every result of the session carries the same version, 1 + the writer's
    // transactions the copy saw; those number between what was written before and after it.
    const client = createClient({ url: `file:${restoredPath}` });
    const versions = (
      await client.execute({ sql: "SELECT DISTINCT version FROM results WHERE session_id = ?", args: [sessionId] })
    ).rows.map((r) => Number(r[0]));
    const seen = Number(
      (await client.execute("SELECT count(*) FROM audit_events WHERE after LIKE '%busy-writer%'")).rows[0][0],
    );
    const mode = String((await client.execute("PRAGMA journal_mode")).rows[0][0]);
    client.close();
    expect(versions).toEqual([1 + seen]);
    expect(seen).toBeGreaterThanOrEqual(writtenBefore);
    expect(seen).toBeLessThanOrEqual(writtenAfter);
    expect(mode).toBe("wal");

    // Tables the writer never touched are identical to the live database's.
    const [liveHashes, restoredHashes] = [await tableHashes(getClient()), await hashesOf(restoredPath)];
    for (const table of Object.keys(liveHashes).filter((t) => t !== "results" && t !== "audit_events")) {
      expect([table, restoredHashes[table]]).toEqual([table, liveHashes[table]]);
    }
    console.log(
      `backup: ${(backup.bytes / 1024 / 1024).toFixed(0)} MB copied while a second process committed transactions ${writtenBefore}→${writtenAfter} (of ${total}); the copy holds ${seen}, every version = ${1 + seen}; restored copy identical (${Object.keys(restoredHashes).length} tables), integrity ok`,
    );
    expect(existsSync(live)).toBe(true);
  }, 60_000);

  it("refuses a damaged backup, a database still in use, and a libSQL server URL — touching nothing", async () => {
    const backup = await backupDatabase({ url: env.url, dir: join(dir, "backups") });
    const target = join(dir, "target.db");
    copyFileSync(backup.path, target);
    const untouched = await hashesOf(target);

    const notADatabase = join(dir, "notes.db");
    writeFileSync(notADatabase, "athlete,test,trial,value\n".repeat(400));
    await expect(restoreDatabase(notADatabase, { url: `file:${target}` })).rejects.toThrow(/damaged or not a database/);

    // A real backup with garbage written over two of its pages.
    const damaged = join(dir, "damaged.db");
    copyFileSync(backup.path, damaged);
    const fd = openSync(damaged, "r+");
    const pageSize = readFileSync(damaged).readUInt16BE(16);
    writeSync(fd, Buffer.alloc(pageSize * 2, 0xa5), 0, pageSize * 2, pageSize * 3);
    closeSync(fd);
    await expect(restoreDatabase(damaged, { url: `file:${target}` })).rejects.toThrow(/damaged or not a database/);

    const notOurs = join(dir, "other.db");
    const other = createClient({ url: `file:${notOurs}` });
    await other.execute("CREATE TABLE t (x)");
    other.close();
    await expect(restoreDatabase(notOurs, { url: `file:${target}` })).rejects.toThrow(/not a Changewise database/);

    // The test's own app connection holds the live database open.
    await getClient().execute("SELECT 1");
    await expect(restoreDatabase(backup.path, { url: env.url })).rejects.toThrow(/open in another process/);

    await expect(backupDatabase({ url: "libsql://127.0.0.1:8080", dir: join(dir, "backups") })).rejects.toThrow(
      /libSQL server's own snapshot\/backup facility/,
    );
    await expect(restoreDatabase(backup.path, { url: "libsql://127.0.0.1:8080" })).rejects.toThrow(
      /libSQL server's own snapshot\/backup facility/,
    );
    expect(await hashesOf(target)).toEqual(untouched);

    // Onto a closed database it works, and keeps the one it replaced.
    const done = await restoreDatabase(backup.path, { url: `file:${target}` });
    expect(done.previous).toMatch(/target\.db\.before-restore-\d{8}-\d{6}$/);
    expect(await hashesOf(done.previous!)).toEqual(untouched);
  }, 60_000);
});
