/**
 * The browser bundle carries no database schema: client modules take the domain words from
 * lib/domain, and the data layer is server-only. The build these tests serve is the one checked.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const STATIC = join(process.cwd(), ".next", "static");

function scripts(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? scripts(path) : name.endsWith(".js") ? [path] : [];
  });
}

// Names that exist only in db/schema.ts (table and column names, drizzle's table classes).
const SCHEMA_MARKERS = [
  "SQLiteTable",
  "sqliteTable",
  "password_reset_tokens",
  "sign_in_attempts",
  "password_hash",
  "organization_id",
  "audit_events",
];

describe("client bundle", () => {
  it("holds no schema or table names", () => {
    const files = scripts(STATIC);
    expect(files.length).toBeGreaterThan(5);
    const hits: string[] = [];
    for (const file of files) {
      const text = readFileSync(file, "utf8");
      for (const marker of SCHEMA_MARKERS)
        if (text.includes(marker)) hits.push(`${file.slice(STATIC.length + 1)}: ${marker}`);
    }
    expect(hits).toEqual([]);
  });
});
