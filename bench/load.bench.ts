/**
 * Sustained request rates against the production build on the demo club (loopback only).
 *
 * A bounded closed loop: N workers each send their next request as soon as the last one is
 * answered, for a few seconds per step, at N = 1, 4, 8, 16. The figure reported is the rate at
 * the highest N whose 95th-percentile latency stays under 100 ms, with that p95.
 *
 * - sheet-read-*: GET /api/sessions/[id], the Session sheet's data (busiest demo session).
 * - sheet-save-*: PUT /api/sessions/[id]/results, one cell per worker, carrying the version it
 *   read; values alternate so every save really changes the cell (and writes its audit entry).
 *
 * Load generator and server share this machine's cores, so these are lower bounds.
 */
import { HttpSession } from "../tests/helpers/http";
import { startProductionServer } from "../tests/helpers/server";
import type { BenchResult } from "./harness";

const LEVELS = [1, 4, 8, 16];
const STEP_MS = 4000;
const WARMUP_MS = 1500;
const P95_LIMIT_MS = 100;

type Step = { concurrency: number; rps: number; p50: number; p95: number; requests: number; failures: number };

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];

/** Runs `concurrency` workers for `ms`; each request returns whether it got the answer it should. */
async function closedLoop(
  concurrency: number,
  ms: number,
  request: (worker: number) => Promise<boolean>,
): Promise<Step> {
  const latencies: number[] = [];
  let failures = 0;
  const started = performance.now();
  const until = started + ms;
  await Promise.all(
    Array.from({ length: concurrency }, async (_, worker) => {
      while (performance.now() < until) {
        const t0 = performance.now();
        if (!(await request(worker))) failures++;
        latencies.push(performance.now() - t0);
      }
    }),
  );
  const elapsed = (performance.now() - started) / 1000;
  latencies.sort((a, b) => a - b);
  return {
    concurrency,
    rps: latencies.length / elapsed,
    p50: percentile(latencies, 0.5),
    p95: percentile(latencies, 0.95),
    requests: latencies.length,
    failures,
  };
}

async function sweep(request: (worker: number) => Promise<boolean>): Promise<Step[]> {
  await closedLoop(4, WARMUP_MS, request);
  const steps: Step[] = [];
  for (const concurrency of LEVELS) steps.push(await closedLoop(concurrency, STEP_MS, request));
  return steps;
}

function report(prefix: string, what: string, steps: Step[]): BenchResult[] {
  const failures = steps.reduce((n, s) => n + s.failures, 0);
  if (failures > 0) throw new Error(`${what}: ${failures} requests did not get the expected answer`);
  const within = steps.filter((s) => s.p95 < P95_LIMIT_MS);
  const chosen = within.at(-1) ?? steps[0];
  const trail = steps.map((s) => `c${s.concurrency} ${s.rps.toFixed(0)}/s p95 ${s.p95.toFixed(1)}`).join(", ");
  return [
    {
      name: `${prefix}-rps`,
      value: chosen.rps,
      unit: "req/s",
      detail: `${what} at concurrency ${chosen.concurrency} (highest with p95 < ${P95_LIMIT_MS} ms); ${trail}`,
    },
    {
      name: `${prefix}-p95-ms`,
      value: chosen.p95,
      unit: "ms",
      target: P95_LIMIT_MS,
      detail: `p95 at concurrency ${chosen.concurrency} (p50 ${chosen.p50.toFixed(1)} ms, ${chosen.requests} requests in ${STEP_MS / 1000} s)`,
    },
  ];
}

export default async function load(): Promise<BenchResult[]> {
  const server = await startProductionServer();
  try {
    const http = new HttpSession(server.baseUrl);
    if (!(await http.signIn("scientist@example.com")).signedIn) throw new Error("sign-in failed");
    const { json } = await http.json("/api/sessions");
    const sessions = json.sessions as { id: number; status: string; resultCount: number }[];
    const busiest = sessions.reduce((a, b) => (b.resultCount > a.resultCount ? b : a));
    const draft = sessions
      .filter((s) => s.status === "draft")
      .reduce((a, b) => (b.resultCount > a.resultCount ? b : a));

    const read = await sweep(async () => {
      const response = await http.fetch(`/api/sessions/${busiest.id}`);
      await response.arrayBuffer();
      return response.status === 200;
    });

    // One cell per worker (different athletes, one test), each with the version it last saw.
    const sheet = (await http.json(`/api/sessions/${draft.id}`)).json as {
      results: { athleteId: number; testId: number; version: number }[];
    };
    const testId = sheet.results[0].testId;
    const cells = sheet.results.filter((r) => r.testId === testId).slice(0, Math.max(...LEVELS));
    if (cells.length < Math.max(...LEVELS))
      throw new Error(`session ${draft.id} has only ${cells.length} cells for one test`);
    const versions = cells.map((c) => c.version);
    const flips = cells.map(() => 0);
    const save = await sweep(async (worker) => {
      const cell = cells[worker];
      flips[worker] ^= 1;
      const body = {
        results: [
          {
            athleteId: cell.athleteId,
            testId,
            trials: [flips[worker] ? 31.1 : 31.2],
            flag: null,
            version: versions[worker],
          },
        ],
      };
      const response = await http.fetch(`/api/sessions/${draft.id}/results`, {
        method: "PUT",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      });
      const answer = (await response.json()) as { results?: { version: number }[] };
      if (response.status !== 200 || !answer.results) return false;
      versions[worker] = answer.results[0].version;
      return true;
    });

    return [
      ...report("sheet-read", `GET /api/sessions/[id] (${busiest.resultCount} results)`, read),
      ...report("sheet-save", "PUT /api/sessions/[id]/results, one versioned cell per worker", save),
    ];
  } finally {
    await server.stop();
  }
}
