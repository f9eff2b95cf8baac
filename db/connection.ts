/**
 * Opening a database: the embedded SQLite file or a libSQL server. Plain, so scripts (migrate,
 * seed, bench) can use it; the app reaches the database through `db/client.ts`.
 */
import { type Client, createClient } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

export const DEFAULT_DATABASE_URL = "file:./data/changewise.db";

export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

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
