/**
 * What a database holds, as comparable strings: "did this refused request change anything?"
 * and "is this copy the same content as that one?". Plus switching the app to a fresh copy of a
 * template file, so a request that did change something does not disturb the next one.
 */
import { createHash } from "node:crypto";
import { copyFileSync } from "node:fs";
import type { Client } from "@libsql/client";
import { getClient } from "@/db/client";

/** The checksum the evidence suite prints: results count, sum of values, and every id:version. */
export async function resultsChecksum(client: Client = getClient()): Promise<string> {
  const { rows } = await client.execute(
    "SELECT count(*) AS n, total(value) AS total, group_concat(id || ':' || version) AS versions FROM (SELECT id, value, version FROM results ORDER BY id)",
  );
  const [row] = rows;
  return `${row.n}|${row.total}|${row.versions ?? ""}`;
}

function cell(value: unknown): unknown {
  if (value instanceof ArrayBuffer) return createHash("sha256").update(new Uint8Array(value)).digest("hex");
  if (typeof value === "bigint") return value.toString();
  return value;
}

/** One hash per table over every row in rowid order (sign-in bookkeeping left out). */
export async function tableHashes(client: Client = getClient()): Promise<Record<string, string>> {
  const { rows: tables } = await client.execute(
    "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name <> 'sign_in_attempts' ORDER BY name",
  );
  const hashes: Record<string, string> = {};
  for (const t of tables) {
    const name = String(t.name);
    const result = await client.execute(`SELECT * FROM "${name}" ORDER BY rowid`);
    const hash = createHash("sha256");
    for (const row of result.rows) hash.update(JSON.stringify(result.columns.map((c) => cell(row[c]))));
    hashes[name] = `${result.rows.length}:${hash.digest("hex").slice(0, 16)}`;
  }
  return hashes;
}

export async function fingerprint(client: Client = getClient()): Promise<string> {
  return JSON.stringify(await tableHashes(client));
}

/** A consistent single-file copy of the app's current database (WAL folded in). */
export async function snapshotTo(path: string, client: Client = getClient()): Promise<void> {
  await client.execute({ sql: "VACUUM INTO ?", args: [path] });
}

let copies = 0;

/** Points the app at a fresh copy of `template` (closing the current connection first). */
export function switchToFreshCopy(template: string, dir: string): string {
  getClient().close();
  const path = `${dir}/copy-${++copies}.db`;
  copyFileSync(template, path);
  process.env.DATABASE_URL = `file:${path}`;
  return path;
}
