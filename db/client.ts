import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

export const DEFAULT_DATABASE_URL = "file:./data/changewise.db";

type Cached = { url: string; client: Client; db: Database };

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
    // One connection for an embedded file: SQLite serialises writers anyway, and
    // per-connection settings then hold for every statement.
    concurrency: isFile ? 1 : undefined,
    timeout: isFile ? 5000 : undefined,
  });
  return { client, db: drizzle(client, { schema }) };
}

/** Embedded-file tuning; a libSQL server manages these itself. */
export async function tuneFileDatabase(client: Client, url: string): Promise<void> {
  if (!url.startsWith("file:")) return;
  await client.execute("PRAGMA journal_mode = WAL");
  await client.execute("PRAGMA foreign_keys = ON");
  await client.execute("PRAGMA busy_timeout = 5000");
  await client.execute("PRAGMA synchronous = NORMAL");
}

function cached(): Cached {
  const url = databaseUrl();
  const current = globalCache.__changewiseDb;
  if (current && current.url === url) return current;
  const opened = openDatabase(url, process.env.DATABASE_AUTH_TOKEN);
  const entry = { url, ...opened };
  // Not awaited: pragmas queue on the single connection before any later statement.
  void tuneFileDatabase(opened.client, url);
  globalCache.__changewiseDb = entry;
  return entry;
}

export function getDb(): Database {
  return cached().db;
}

export function getClient(): Client {
  return cached().client;
}
