import "server-only";
import type { Client } from "@libsql/client";
import { type Database, databaseUrl, openDatabase, type Transaction } from "./connection";

export type { Database, Transaction } from "./connection";

/** What a read needs: the database itself, or the transaction a write is running in. */
export type Reader = Pick<Database, "select">;

type Cached = { url: string; client: Client; db: Database; writes: Promise<unknown> };

// Hot reload in development re-evaluates modules; keeping the client on globalThis
// stops every reload from opening another connection to the same file.
const globalCache = globalThis as typeof globalThis & { __changewiseDb?: Cached };

function cached(): Cached {
  const url = databaseUrl();
  const current = globalCache.__changewiseDb;
  if (current && current.url === url) return current;
  // WAL is a property of the file, set once by the migrator; nothing to tune per connection.
  const entry = {
    url,
    ...openDatabase(url, process.env.DATABASE_AUTH_TOKEN),
    writes: Promise.resolve() as Promise<unknown>,
  };
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
