import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

export const DEFAULT_DATABASE_URL = "file:./data/changewise.db";

type Cached = { url: string; client: Client; db: Database; writes: Promise<unknown> };

export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

// Hot reload in development re-evaluates modules; keeping the client on globalThis
// stops every reload from opening another connection to the same file.
const globalCache = globalThis as typeof globalThis & { __changewiseDb?: Cached };

export function databaseUrl(): string {
  return process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
}

export function openDatabase(url: string, authToken?: string): { client: Client; db: Database } {
  const isFile = url.startsWith("file:");
  const client = createClient({
    url,
    authToken: isFile ? undefined : authToken,
    // Several connections, so reads go on (WAL) while a write transaction is open;
    // libSQL opens each with foreign keys on, and `timeout` is its busy timeout.
    concurrency: isFile ? 4 : undefined,
    timeout: isFile ? 5000 : undefined,
  });
  return { client, db: drizzle(client, { schema }) };
}

/**
 * Switches an embedded file to write-ahead logging, which is stored in the file itself.
 * Per-connection settings do not belong here: the pool opens connections lazily, and
 * libSQL already opens each with foreign keys on and `timeout` as its busy timeout.
 */
export async function enableWriteAheadLog(client: Client, url: string): Promise<void> {
  if (url.startsWith("file:")) await client.execute("PRAGMA journal_mode = WAL");
}

function cached(): Cached {
  const url = databaseUrl();
  const current = globalCache.__changewiseDb;
  if (current && current.url === url) return current;
  // WAL is a property of the file, set once by the migrator; nothing to tune per connection.
  const entry = { url, ...openDatabase(url, process.env.DATABASE_AUTH_TOKEN), writes: Promise.resolve() as Promise<unknown> };
  globalCache.__changewiseDb = entry;
  return entry;
}

export function getDb(): Database {
  return cached().db;
}

export function getClient(): Client {
  return cached().client;
}

/**
 * Runs a write transaction (BEGIN IMMEDIATE), one at a time per process.
 *
 * The embedded driver is synchronous: a second BEGIN IMMEDIATE in this process would
 * block the event loop in SQLite's busy handler while the first transaction waits on that
 * same loop to finish, and both would fail. Queueing writers here avoids that; the busy
 * timeout still covers writers in other processes. Every write goes through this.
 */
export function writeTransaction<T>(work: (tx: Transaction) => Promise<T>): Promise<T> {
  const entry = cached();
  const run = entry.writes.then(() => entry.db.transaction(work));
  entry.writes = run.catch(() => undefined);
  return run;
}
