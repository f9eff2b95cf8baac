/**
 * `npm run db:restore -- <backup file>` — puts a backup in place of the embedded database.
 *
 * Stop the app first: the restore refuses while any process has the database open (it asks
 * SQLite to leave write-ahead-log mode, which only the sole user of a database can do). It also
 * refuses a backup that fails `PRAGMA integrity_check` or is not a Changewise database. The
 * database it replaces is kept beside it as `<name>.before-restore-YYYYMMDD-HHMMSS`.
 */
import { copyFileSync, existsSync, mkdirSync, renameSync, rmSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { databaseUrl } from "../db/connection";
import { DatabaseFileError, databaseFilePath, integrityOf, openFile, timestamp } from "./db-file";

export type Restore = { path: string; previous: string | null };

async function assertChangewiseDatabase(file: string) {
  const integrity = await integrityOf(file);
  if (integrity !== "ok")
    throw new DatabaseFileError(
      `${file} is damaged or not a database (integrity check: ${integrity}). Nothing was restored.`,
    );
  const client = openFile(file);
  try {
    const { rows } = await client.execute(
      "SELECT name FROM sqlite_master WHERE type = 'table' AND name IN ('results', 'testing_sessions', '__drizzle_migrations')",
    );
    if (rows.length < 3)
      throw new DatabaseFileError(`${file} is a SQLite file but not a Changewise database. Nothing was restored.`);
  } finally {
    client.close();
  }
}

/** Leaves WAL mode, which SQLite allows only to the one connection that has the file open. */
async function assertNotInUse(target: string) {
  const client = openFile(target);
  try {
    const { rows } = await client.execute("PRAGMA journal_mode = DELETE");
    if (String(rows[0][0]).toLowerCase() !== "delete") throw new Error("busy");
  } catch (error) {
    const busy =
      error instanceof Error &&
      (error.message === "busy" || /SQLITE_BUSY|locked/i.test(`${(error as { code?: string }).code} ${error.message}`));
    if (!busy)
      throw new DatabaseFileError(
        `${target} could not be opened (${error instanceof Error ? error.message : error}). Nothing was restored.`,
      );
    throw new DatabaseFileError(
      `${target} is open in another process (is the app running?). Stop it, then restore. Nothing was restored.`,
    );
  } finally {
    client.close();
  }
}

export async function restoreDatabase(
  backup: string,
  { url = databaseUrl(), now = new Date() } = {},
): Promise<Restore> {
  const target = databaseFilePath(url, "restore it");
  const source = resolve(backup);
  if (!existsSync(source)) throw new DatabaseFileError(`There is no backup at ${source}.`);
  if (source === target) throw new DatabaseFileError("That backup is the database itself.");
  await assertChangewiseDatabase(source);

  let previous: string | null = null;
  if (existsSync(target)) {
    await assertNotInUse(target);
    previous = `${target}.before-restore-${timestamp(now)}`;
    renameSync(target, previous);
  }
  for (const suffix of ["-wal", "-shm", "-journal"]) rmSync(`${target}${suffix}`, { force: true });
  mkdirSync(dirname(target), { recursive: true });
  // Copy beside the target, then rename: the database path never holds half a file.
  const partial = `${target}.restoring`;
  copyFileSync(source, partial);
  renameSync(partial, target);

  const client = openFile(target);
  try {
    await client.execute("PRAGMA journal_mode = WAL");
  } finally {
    client.close();
  }
  const integrity = await integrityOf(target);
  if (integrity !== "ok")
    throw new DatabaseFileError(`The restored database failed its integrity check: ${integrity}.`);
  return { path: target, previous };
}

const invokedDirectly = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  const file = process.argv[2];
  if (!file) {
    console.error("Usage: npm run db:restore -- <backup file>   (stop the app first)");
    process.exit(1);
  }
  restoreDatabase(file)
    .then((r) => {
      console.log(`Restored ${resolve(file)} to ${r.path} (integrity ok).`);
      if (r.previous) console.log(`The database it replaced is kept at ${r.previous}.`);
    })
    .catch((error) => {
      console.error(
        error instanceof DatabaseFileError
          ? error.message
          : `Restore failed: ${error instanceof Error ? error.message : error}`,
      );
      process.exit(1);
    });
}
