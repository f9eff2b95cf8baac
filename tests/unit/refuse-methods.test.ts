/**
 * Methods an address does not take are answered 405 with Allow where Node hands requests to Next.js:
 * TRACE included (Next.js would build a fetch Request for proxy.ts, which fetch forbids, and answer
 * 500), and requests with a body (which skip proxy.ts). TRACK: Node's parser refuses it.
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { refuseUnsupportedMethods } from "@/lib/api/refuse-methods";

let server: http.Server;
let undo: () => void;
let port = 0;

beforeAll(async () => {
  undo = refuseUnsupportedMethods();
  // Stands in for Next.js: any request it is handed fails the way Next.js fails on TRACE.
  server = http.createServer((request, response) => {
    if (request.method === "TRACE" || request.method === "TRACK") {
      response.writeHead(500).end("Internal Server Error");
      return;
    }
    response.writeHead(200).end("next");
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  port = (server.address() as AddressInfo).port;
});
afterAll(async () => {
  undo();
  await new Promise((resolve) => server.close(resolve));
});

function send(
  method: string,
  path: string,
  body?: string,
): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string }> {
  return new Promise((resolve, reject) => {
    const headers =
      body === undefined
        ? {}
        : { "content-type": "application/json", "content-length": String(Buffer.byteLength(body)) };
    const req = http.request({ host: "127.0.0.1", port, method, path, headers }, (res) => {
      let body = "";
      res.on("data", (chunk) => (body += chunk));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on("error", reject);
    req.end(body);
  });
}

describe("refuseUnsupportedMethods", () => {
  it("answers TRACE with 405 and the address's Allow list, with the security headers", async () => {
    for (const method of ["TRACE"]) {
      const page = await send(method, "/sign-in?x=1");
      expect(page.status, method).toBe(405);
      expect(page.headers.allow).toBe("GET, HEAD");
      expect(page.headers["x-content-type-options"]).toBe("nosniff");
      expect(page.headers["content-security-policy"]).toContain("frame-ancestors 'none'");
      const api = await send(method, "/api/me");
      expect(api.status, method).toBe(405);
      expect(api.headers.allow).toBe("GET, HEAD, OPTIONS");
      expect(api.headers["cache-control"]).toBe("no-store");
    }
    expect((await send("TRACE", "/api/nothing-here")).status).toBe(404);
    // Node's own parser answers TRACK before any listener runs.
    expect((await send("TRACK", "/sign-in").catch(() => ({ status: 400 }))).status).toBe(400);
  });

  it("refuses a method the route does not export even with a body, with the route's Allow list", async () => {
    const patch = await send("PATCH", "/api/me", JSON.stringify({ name: "x" }));
    expect(patch.status).toBe(405);
    expect(patch.headers.allow).toBe("GET, HEAD, OPTIONS");
    expect(JSON.parse(patch.body).error.code).toBe("method_not_allowed");
    const get = await send("GET", "/api/sessions/4/results");
    expect(get.status).toBe(405);
    expect(get.headers.allow).toBe("OPTIONS, PUT");
    expect((await send("POST", "/sign-in", "{}")).headers.allow).toBe("GET, HEAD");
  });

  it("hands the methods an address takes, and Next.js's own addresses, to the app", async () => {
    for (const method of ["GET", "HEAD", "OPTIONS"]) expect((await send(method, "/api/me")).status, method).toBe(200);
    expect((await send("PUT", "/api/sessions/4/results", "{}")).status).toBe(200);
    expect((await send("GET", "/sessions/4?x=1")).status).toBe(200);
    expect((await send("POST", "/_next/static/chunks/x.js")).status).toBe(200);
  });
});
