import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { getClient, getDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { users } from "@/db/schema";
import { seedDemo } from "@/scripts/seed";

/**
 * A real SQLite file with every migration applied and the demo club seeded.
 * Sets DATABASE_URL before the app's client is first used, so app code under test
 * talks to this file.
 */
export async function setupTestDatabase({ seed = true } = {}) {
  const dir = mkdtempSync(join(tmpdir(), "changewise-test-"));
  const url = `file:${join(dir, "test.db")}`;
  process.env.DATABASE_URL = url;
  await migrateDatabase(url);
  // bcrypt's lowest cost keeps seeding fast; production hashes use BCRYPT_COST.
  if (seed) await seedDemo(getDb(), { passwordCost: 4 });
  return {
    url,
    db: getDb(),
    cleanup() {
      getClient().close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export async function userIdOf(email: string): Promise<number> {
  const [row] = await getDb().select({ id: users.id }).from(users).where(eq(users.email, email));
  if (!row) throw new Error(`No test user ${email}`);
  return row.id;
}
