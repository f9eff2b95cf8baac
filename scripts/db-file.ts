/**
 * The embedded database file behind a DATABASE_URL, for the backup and restore scripts. A libSQL
 * server is not a file on this machine: its own snapshot and backup facility is the way there.
 */
import { resolve } from "node:path";
import { type Client, createClient } from "@libsql/client";

export class DatabaseFileError extends Error {}

export function databaseFilePath(url: string, action: string): string {
  if (!url.startsWith("file:")) {
    const server = url.replace(/\/\/[^@/]*@/, "//…@").split("?")[0];
    throw new DatabaseFileError(
      `DATABASE_URL points at a libSQL server (${server}), not an embedded file. To ${action}, use the libSQL server's own snapshot/backup facility; these scripts handle only file: databases.`,
    );
  }
  const path = url
    .slice("file:".length)
    .split("?")[0]
    .replace(/^\/\/(localhost)?/, "");
  if (!path || path === ":memory:") throw new DatabaseFileError(`DATABASE_URL=${url} is not a database file.`);
  return resolve(path);
}

/** A short-lived connection that gives up quickly on a lock instead of waiting 5 s. */
export function openFile(path: string, timeoutMs = 200): Client {
  return createClient({ url: `file:${path}`, timeout: timeoutMs });
}

/** `PRAGMA integrity_check` as one line: "ok", or the first problems SQLite names. */
export async function integrityOf(path: string): Promise<string> {
  const client = openFile(path);
  try {
    const { rows } = await client.execute("PRAGMA integrity_check");
    return rows
      .map((r) => String(r[0]))
      .slice(0, 5)
      .join("; ");
  } catch (error) {
    return `unreadable: ${error instanceof Error ? error.message : String(error)}`;
  } finally {
    client.close();
  }
}

/** YYYYMMDD-HHMMSS in UTC, so names sort by time whatever the machine's zone. */
export function timestamp(date = new Date()): string {
  return date.toISOString().replace(/[-:]/g, "").replace("T", "-").slice(0, 15);
}
