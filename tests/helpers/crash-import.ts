/**
 * A process to be killed mid-import (tests/integration/crash-import.test.ts). Commits a CSV into a
 * session through runImport, the code the import route calls, and reports each step of the write
 * transaction on stdout. With a pause point it stops dead inside the open transaction, so the
 * parent's SIGKILL lands exactly there.
 *
 *   tsx --conditions=react-server tests/helpers/crash-import.ts <db-url> <user-id> <session-id> <csv> [pause]
 *   pause: "statement:<n>" (after the n-th statement of the transaction) or "commit" (just before COMMIT)
 */
import { readFileSync } from "node:fs";
import type { Transaction, TransactionMode } from "@libsql/client";

const [url, userId, sessionId, csvPath, pause = ""] = process.argv.slice(2);
process.env.DATABASE_URL = url;

const { getClient } = await import("../../db/client");
const { loadActor } = await import("../../lib/data/actors");
const { runImport } = await import("../../lib/data/import");
const { importOptionsSchema } = await import("../../lib/validation/import");

const say = (line: string) => process.stdout.write(`${line}\n`); // synchronous on a pipe (Linux)
const freeze = () => Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 60_000);

// Watch the write transaction from outside: the app code runs unchanged.
const client = getClient();
const open = client.transaction.bind(client);
client.transaction = async (mode?: TransactionMode) => {
  const tx: Transaction = await open(mode);
  say("transaction open");
  let statements = 0;
  const execute = tx.execute.bind(tx);
  tx.execute = async (stmt) => {
    const result = await execute(stmt);
    statements++;
    say(`statement ${statements}`);
    if (pause === `statement:${statements}`) {
      say("paused");
      freeze();
    }
    return result;
  };
  const commit = tx.commit.bind(tx);
  tx.commit = async () => {
    if (pause === "commit") {
      say("paused");
      freeze();
    }
    await commit();
    say("committed");
  };
  return tx;
};

const actor = await loadActor(Number(userId));
if (!actor) throw new Error(`No member with user id ${userId}`);
const bytes = new Uint8Array(readFileSync(csvPath));
const options = importOptionsSchema.parse({ mode: "commit", replace: "yes" });
say("committing");
const answer = await runImport(
  actor,
  Number(sessionId),
  { bytes, filename: "crash.csv", contentType: "text/csv" },
  options,
);
say(`done ${JSON.stringify("counts" in answer ? answer.counts : null)}`);
client.close();
