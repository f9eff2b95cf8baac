import { mkdirSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/libsql/migrator";
import { databaseUrl, enableWriteAheadLog, openDatabase } from "./connection";

const migrationsFolder = resolve(dirname(fileURLToPath(import.meta.url)), "../drizzle");

/** Creates the folder of a file database, so a fresh clone needs no manual step. */
function ensureFileFolder(url: string) {
  if (!url.startsWith("file:")) return;
  const path = url.slice("file:".length).replace(/^\/\/(localhost)?/, "");
  if (path && path !== ":memory:") mkdirSync(dirname(resolve(path)), { recursive: true });
}

export async function migrateDatabase(url = databaseUrl(), authToken = process.env.DATABASE_AUTH_TOKEN) {
  ensureFileFolder(url);
  const { client, db } = openDatabase(url, authToken);
  try {
    await enableWriteAheadLog(client, url);
    await migrate(db, { migrationsFolder });
  } finally {
    client.close();
  }
}

const invokedDirectly = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  migrateDatabase()
    .then(() => console.log(`Database ready at ${databaseUrl()}`))
    .catch((error) => {
      console.error("Migration failed:", error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
