/**
 * Serves the production build on a fresh seeded database: the browser tests and the page
 * benchmarks run against exactly what `npm run demo` serves.
 */
import { type ChildProcess, spawn, spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { openDatabase } from "../../db/connection";
import { migrateDatabase } from "../../db/migrate";
import { startMailFake } from "../../scripts/mail-fake.mjs";
import { seedDemo } from "../../scripts/seed";

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() =>
        typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port")),
      );
    });
  });
}

async function waitFor(url: string, child: ChildProcess, timeoutMs = 60_000) {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}`);
    try {
      const response = await fetch(url);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`Server did not answer ${url} within ${timeoutMs} ms`);
}

const SOURCE_DIRS = ["app", "components", "hooks", "lib", "db", "types"];
const SOURCE_FILES = [
  "proxy.ts",
  "instrumentation.ts",
  "next.config.ts",
  "tailwind.config.ts",
  "postcss.config.mjs",
  "package-lock.json",
];

function newestSourceChange(): number {
  let newest = 0;
  const visit = (path: string) => {
    const stat = statSync(path, { throwIfNoEntry: false });
    if (!stat) return;
    if (stat.isDirectory()) for (const entry of readdirSync(path)) visit(join(path, entry));
    else newest = Math.max(newest, stat.mtimeMs);
  };
  [...SOURCE_DIRS, ...SOURCE_FILES].forEach(visit);
  return newest;
}

/** A build older than any source file would test yesterday's app. */
export function buildIsCurrent(): boolean {
  return existsSync(".next/BUILD_ID") && statSync(".next/BUILD_ID").mtimeMs >= newestSourceChange();
}

export type RunningServer = {
  baseUrl: string;
  databaseUrl: string;
  /** Where the local mail fake writes every message the server sends, as .eml files. */
  outboxDir: string;
  stop: () => Promise<void>;
};

/** Builds once if the build is missing or older than the code, then starts `next start` on a free port. */
/**
 * `databaseUrl` serves an existing database as it is (a benchmark's prepared file); without it
 * a fresh database is migrated and seeded with the demo club.
 */
export async function startProductionServer({
  databaseUrl: given,
}: {
  databaseUrl?: string;
} = {}): Promise<RunningServer> {
  if (!buildIsCurrent() || process.env.E2E_BUILD === "1") {
    const build = spawnSync("npx", ["next", "build"], {
      stdio: "inherit",
      env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
    });
    if (build.status !== 0) throw new Error("next build failed");
  }
  const dir = mkdtempSync(join(tmpdir(), "changewise-e2e-"));
  const databaseUrl = given ?? `file:${join(dir, "e2e.db")}`;
  if (!given) {
    await migrateDatabase(databaseUrl);
    const { client, db } = openDatabase(databaseUrl);
    await seedDemo(db, { passwordCost: 4 });
    client.close();
  }

  const outboxDir = join(dir, "outbox");
  const mail = await startMailFake({ dir: outboxDir });
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn("node_modules/.bin/next", ["start", "-p", String(port), "-H", "127.0.0.1"], {
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      NEXTAUTH_SECRET: "e2e-only-secret-not-for-production-0123456789",
      NEXTAUTH_URL: baseUrl,
      NEXT_TELEMETRY_DISABLED: "1",
      NODE_ENV: "production",
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(mail.port),
      SMTP_SECURE: "false",
      MAIL_FROM: "Changewise <no-reply@changewise.invalid>",
      MAIL_OUTBOX_DIR: outboxDir,
    },
    stdio: ["ignore", "ignore", "inherit"],
  });
  await waitFor(`${baseUrl}/sign-in`, child);
  return {
    baseUrl,
    databaseUrl,
    outboxDir,
    async stop() {
      await mail.close();
      child.kill("SIGTERM");
      await new Promise((r) => setTimeout(r, 300));
      if (child.exitCode === null) child.kill("SIGKILL");
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
