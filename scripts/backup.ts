/**
 * `npm run db:backup` — a consistent copy of the embedded database while the app keeps serving.
 *
 * VACUUM INTO reads the whole database inside one read transaction: with write-ahead logging,
 * writers carry on meanwhile and the copy is the database as of one instant, never half a write.
 * The copy is checked (`PRAGMA integrity_check`) before the script reports success.
 *
 *   npm run db:backup                    → backups/changewise-YYYYMMDD-HHMMSS.db (UTC)
 *   BACKUP_DIR=/mnt/safe npm run db:backup
 */
import { existsSync, mkdirSync, statSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { databaseUrl } from "../db/connection";
import { DatabaseFileError, databaseFilePath, integrityOf, openFile, timestamp } from "./db-file";

export type Backup = { path: string; bytes: number; integrity: string; results: number };

export async function backupDatabase({
  url = databaseUrl(),
  dir = process.env.BACKUP_DIR || "backups",
  now = new Date(),
} = {}): Promise<Backup> {
  const source = databaseFilePath(url, "back it up");
  // Opening a missing file would create an empty database and "back up" nothing.
  if (!existsSync(source)) throw new DatabaseFileError(`There is no database at ${source}.`);
  mkdirSync(dir, { recursive: true });
  const stem = join(resolve(dir), `changewise-${timestamp(now)}`);
  let path = `${stem}.db`;
  for (let n = 2; existsSync(path); n++) path = `${stem}-${n}.db`;

  // The app's writers hold the lock for milliseconds; wait as long as the app itself would.
  const client = openFile(source, 5000);
  try {
    await client.execute({ sql: "VACUUM INTO ?", args: [path] });
  } finally {
    client.close();
  }
  const integrity = await integrityOf(path);
  const check = openFile(path);
  try {
    const results = Number((await check.execute("SELECT count(*) FROM results")).rows[0][0]);
    return { path, bytes: statSync(path).size, integrity, results };
  } finally {
    check.close();
  }
}

const invokedDirectly = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  backupDatabase()
    .then((b) => {
      if (b.integrity !== "ok") throw new Error(`The copy at ${b.path} failed its integrity check: ${b.integrity}`);
      console.log(
        `Backed up ${databaseUrl()} to ${b.path} (${(b.bytes / 1024 / 1024).toFixed(1)} MB, ${b.results} results, integrity ok).`,
      );
    })
    .catch((error) => {
      console.error(
        error instanceof DatabaseFileError
          ? error.message
          : `Backup failed: ${error instanceof Error ? error.message : error}`,
      );
      process.exit(1);
    });
}
