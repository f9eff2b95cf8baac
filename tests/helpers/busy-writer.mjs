/**
 * A second process writing to the database while a backup runs (tests/integration/backup.test.ts).
 * Each transaction bumps the version of every result in one session and logs one audit row, so a
 * consistent copy shows: versions all equal, and equal to 1 + the number of those audit rows.
 *
 *   node tests/helpers/busy-writer.mjs <db-url> <session-id>     (send "stop" on stdin to end)
 */
import { createClient } from "@libsql/client";

const [url, sessionId] = process.argv.slice(2);
const client = createClient({ url, timeout: 5000 });
let written = 0;
let stopping = false;
process.stdin.on("data", (chunk) => {
  if (String(chunk).includes("stop")) stopping = true;
});

while (!stopping) {
  await client.batch(
    [
      { sql: "UPDATE results SET version = version + 1 WHERE session_id = ?", args: [Number(sessionId)] },
      {
        sql: "INSERT INTO audit_events (organization_id, action, entity_type, session_id, after) VALUES (1, 'result.update', 'result', ?, ?)",
        args: [Number(sessionId), JSON.stringify({ writer: "busy-writer", n: written + 1 })],
      },
    ],
    "write",
  );
  written++;
  process.stdout.write(`wrote ${written}\n`);
  // Yield so stdin is read; the loop is otherwise as fast as SQLite commits.
  await new Promise((resolve) => setImmediate(resolve));
}
client.close();
process.stdout.write(`stopped ${written}\n`);
