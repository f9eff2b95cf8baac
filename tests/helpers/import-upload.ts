import { createHash } from "node:crypto";
import { getClient } from "@/db/client";
import { call } from "./session";

type Handler = Parameters<typeof call<{ sessionId: string }>>[0];

/** Posts a file to the import route handler the way the Import page does (multipart, field "file"). */
export function uploadTo(
  handler: Handler,
  sessionId: number,
  content: string | Uint8Array,
  {
    mode = "commit",
    fields = {},
    filename = "scores.csv",
  }: { mode?: "preview" | "commit"; fields?: Record<string, string>; filename?: string } = {},
) {
  const form = new FormData();
  form.set("file", new File([content as BlobPart], filename, { type: "text/csv" }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return call(handler, {
    url: `http://test.local/api/sessions/${sessionId}/import?mode=${mode}`,
    method: "POST",
    params: { sessionId: String(sessionId) },
    body: form,
  });
}

/** A multipart body built ahead of time, so timing a request does not time building it. */
export async function multipartBody(
  content: string | Uint8Array,
  fields: Record<string, string> = {},
  filename = "scores.csv",
) {
  const form = new FormData();
  form.set("file", new File([content as BlobPart], filename, { type: "text/csv" }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const request = new Request("http://test.local/", { method: "POST", body: form });
  return { bytes: new Uint8Array(await request.arrayBuffer()), type: request.headers.get("content-type")! };
}

/** Sends a prepared multipart body to the import handler; status and parsed JSON back. */
export async function postPrepared(
  handler: Handler,
  sessionId: number,
  body: { bytes: Uint8Array; type: string },
  mode: "preview" | "commit",
) {
  const request = new Request(`http://test.local/api/sessions/${sessionId}/import?mode=${mode}`, {
    method: "POST",
    headers: { "content-type": body.type },
    body: body.bytes as BodyInit,
  });
  const response = await handler(request, { params: Promise.resolve({ sessionId: String(sessionId) }) });
  const text = await response.text();
  let json: any = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  return { status: response.status, json };
}

/**
 * A fingerprint of every stored result (ids, trials, values, versions) plus the uploads and
 * audit trail: equal fingerprints mean a refused request wrote nothing at all.
 */
export async function storeChecksum(): Promise<string> {
  const { rows } = await getClient().execute(`
    SELECT (SELECT count(*) FROM results) AS n, (SELECT total(value) FROM results) AS total,
           (SELECT group_concat(id || ':' || trials || ':' || ifnull(value, '-') || ':' || version, '|') FROM (SELECT * FROM results ORDER BY id)) AS cells,
           (SELECT count(*) FROM uploads) AS uploads, (SELECT count(*) FROM audit_events) AS audit`);
  return createHash("sha256").update(JSON.stringify(rows[0])).digest("hex");
}

/**
 * How long `work` held the event loop at a stretch, seen by a 5 ms ticker. `maxGapMs` is wall
 * time between two ticks; on a shared machine it also counts time the process merely waited
 * for a core. `maxBusyMs` is the CPU time the process spent inside the longest-working gap,
 * which only our own work (and the garbage collector) fills: the robust figure to assert on.
 */
export async function longestPause<T>(
  work: () => Promise<T>,
): Promise<{ result: T; maxGapMs: number; maxBusyMs: number; ms: number }> {
  const cpuMs = () => {
    const { user, system } = process.cpuUsage();
    return (user + system) / 1000;
  };
  let last = performance.now();
  let lastCpu = cpuMs();
  let maxGapMs = 0;
  let maxBusyMs = 0;
  const sample = () => {
    const now = performance.now();
    const cpu = cpuMs();
    maxGapMs = Math.max(maxGapMs, now - last);
    maxBusyMs = Math.max(maxBusyMs, Math.min(cpu - lastCpu, now - last));
    last = now;
    lastCpu = cpu;
  };
  const ticker = setInterval(sample, 5);
  const start = performance.now();
  try {
    const result = await work();
    sample();
    return { result, maxGapMs, maxBusyMs, ms: performance.now() - start };
  } finally {
    clearInterval(ticker);
  }
}
