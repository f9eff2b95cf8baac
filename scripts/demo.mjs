#!/usr/bin/env node
// One command from a fresh clone to a running Changewise: database, demo club, build, server.
import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { startMailFake } from "./mail-fake.mjs";

const port = process.env.PORT || "3000";
const hostname = process.env.HOSTNAME && process.env.HOSTNAME !== "0.0.0.0" ? process.env.HOSTNAME : "localhost";
const bindHost = process.env.HOSTNAME || "localhost";
const secretFile = ".demo-secret";

function secret() {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  if (existsSync(secretFile)) return readFileSync(secretFile, "utf8").trim();
  const generated = randomBytes(32).toString("base64url");
  writeFileSync(secretFile, `${generated}\n`, { mode: 0o600 });
  return generated;
}

const env = {
  ...process.env,
  DATABASE_URL: process.env.DATABASE_URL || "file:./data/changewise.db",
  NEXTAUTH_SECRET: secret(),
  NEXTAUTH_URL: process.env.NEXTAUTH_URL || `http://${hostname}:${port}`,
  NEXT_TELEMETRY_DISABLED: "1",
};

function run(label, command, args) {
  console.log(`\n▸ ${label}`);
  const result = spawnSync(command, args, { stdio: "inherit", env });
  if (result.status !== 0) {
    console.error(`\n${label} failed (exit ${result.status ?? result.signal}).`);
    process.exit(result.status ?? 1);
  }
}

run("Preparing the database (migrate, seed the demo club if empty)", "npx", ["tsx", "scripts/seed.ts"]);
if (process.env.SKIP_BUILD !== "1") run("Building Changewise", "npx", ["next", "build"]);

// Without a mail server of your own (SMTP_HOST), mail goes to the local fake and lands as .eml
// files in MAIL_OUTBOX_DIR, readable on the Outbox page.
if (!process.env.SMTP_HOST) {
  env.MAIL_OUTBOX_DIR = process.env.MAIL_OUTBOX_DIR || "data/outbox";
  const fake = await startMailFake({ port: Number(process.env.MAIL_FAKE_PORT) || 0, dir: env.MAIL_OUTBOX_DIR });
  env.SMTP_HOST = "127.0.0.1";
  env.SMTP_PORT = String(fake.port);
  env.SMTP_SECURE = "false";
  console.log(`\n▸ Local mail fake on 127.0.0.1:${fake.port}, writing to ${env.MAIL_OUTBOX_DIR}/`);
}

console.log(`\n▸ Starting Changewise on ${env.NEXTAUTH_URL}`);
const server = spawn("npx", ["next", "start", "-p", port, "-H", bindHost], {
  stdio: ["ignore", "pipe", "inherit"],
  env,
});
server.stdout.on("data", (chunk) => {
  process.stdout.write(chunk);
  if (String(chunk).includes("Ready")) {
    console.log(`
  Changewise is running at ${env.NEXTAUTH_URL}

  Demo accounts (password: changewise-demo)
    owner@example.com         owner, Northfield Harriers & Rovers Performance Unit
    scientist@example.com     sport scientist
    coach@example.com         coach of the Academy U18 squad only
    coach2@example.com        coach of the Senior Women squad only
    athlete@example.com       athlete (Tessa Lindqvist, Senior Women)
    athlete2@example.com      athlete (Priya Damaschke, Senior Women)
    owner@other.example.com   owner of a separate organisation (Kestrel Bay Rowing Academy)

  What to try with each, and which file in examples/ to import: README.md, "Try it".
`);
  }
});
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => server.kill(signal));
server.on("exit", (code) => process.exit(code ?? 0));
