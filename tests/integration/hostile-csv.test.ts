/**
 * Evidence that no upload can break the import: a seeded set of malformed files (see
 * tests/helpers/hostile-csv.ts) goes through the real route handler in preview and in commit
 * mode. No answer may be a 5xx, and a refused commit leaves every stored result, upload and
 * audit event exactly as it was. HOSTILE_SEED and HOSTILE_FILES replay or widen the run.
 */

import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import { sessionTests, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { hostileFiles } from "../helpers/hostile-csv";
import { storeChecksum, uploadTo } from "../helpers/import-upload";
import { sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");

const SEED = Number(process.env.HOSTILE_SEED ?? 20261207);
const COUNT = Number(process.env.HOSTILE_FILES ?? 1000);

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let sessionId = 0;

beforeAll(async () => {
  env = await setupTestDatabase();
  const [academy] = await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Academy U18"));
  [{ id: sessionId }] = await env.db
    .insert(testingSessions)
    .values({ organizationId: 1, squadId: academy.id, date: "2026-12-24", phase: "retest" })
    .returning({ id: testingSessions.id });
  const battery = await env.db.select({ id: tests.id }).from(tests).where(eq(tests.organizationId, 1));
  await env.db.insert(sessionTests).values(battery.map((t, position) => ({ sessionId, testId: t.id, position })));
});
afterAll(() => env.cleanup());

describe("hostile CSV uploads", () => {
  it(`${COUNT} seeded malformed files (seed ${SEED}): never a 5xx, a refused commit changes nothing`, async () => {
    await signInAs("coach@example.com");
    const files = hostileFiles(SEED, COUNT);
    const statuses = new Map<string, number>();
    const count = (key: string) => statuses.set(key, (statuses.get(key) ?? 0) + 1);
    const serverErrors: string[] = [];
    const changedByRefusal: string[] = [];
    let maxMs = 0;
    let slowest = "";
    let baseline = await storeChecksum();

    for (const [index, file] of files.entries()) {
      const label = `#${index} ${file.kind} (${file.bytes.length} bytes)`;
      for (const mode of ["preview", "commit"] as const) {
        const start = performance.now();
        const answer = await uploadTo(importRoute.POST, sessionId, file.bytes, { mode });
        const ms = performance.now() - start;
        if (ms > maxMs) [maxMs, slowest] = [ms, `${label} ${mode}`];
        count(`${mode} ${answer.status}`);
        if (answer.status >= 500)
          serverErrors.push(`${label} ${mode}: ${answer.status} ${JSON.stringify(answer.json).slice(0, 200)}`);
        if (mode === "commit") {
          const now = await storeChecksum();
          if (answer.status === 200) baseline = now;
          else if (now !== baseline) changedByRefusal.push(`${label}: ${answer.status}`);
        }
      }
    }

    // Whatever was accepted is stored as numbers a score can be (finite, |x| ≤ 1e9).
    const { rows } = await getClient().execute({
      sql: `SELECT count(*) AS bad FROM results r, json_each(r.trials) j
            WHERE r.session_id = ? AND (j.type NOT IN ('null', 'integer', 'real') OR abs(j.value) > 1e9 OR abs(ifnull(r.value, 0)) > 1e9)`,
      args: [sessionId],
    });

    const byStatus = [...statuses.entries()]
      .sort()
      .map(([k, v]) => `${k}: ${v}`)
      .join(", ");
    console.log(
      `hostile CSV: ${files.length} files, ${files.length * 2} requests; ${byStatus}; slowest ${maxMs.toFixed(0)} ms (${slowest})`,
    );
    expect(serverErrors).toEqual([]);
    expect(changedByRefusal).toEqual([]);
    expect(Number(rows[0].bad)).toBe(0);
  }, 300_000);
});
