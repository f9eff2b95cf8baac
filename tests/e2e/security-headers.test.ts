/**
 * Security headers and HTTP methods against the production build: every kind of response carries
 * the headers, the pages run under the nonce policy without a single violation, and methods an
 * address does not take get 405 with Allow, never 500.
 */
import http from "node:http";
import type { ConsoleMessage, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Answer = { status: number; headers: Headers };

/** Plain node:http, for methods fetch refuses to send (TRACE). */
function raw(method: string, path: string, headers: Record<string, string> = {}, body?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const url = new URL(path, baseUrl);
    const req = http.request(
      { host: url.hostname, port: url.port, path: url.pathname + url.search, method, headers },
      (res) => {
        res.resume();
        res.on("end", () => {
          const out = new Headers();
          for (const [k, v] of Object.entries(res.headers))
            if (v !== undefined) out.set(k, Array.isArray(v) ? v.join(", ") : v);
          resolve({ status: res.statusCode ?? 0, headers: out });
        });
      },
    );
    req.on("error", reject);
    req.end(body);
  });
}

function expectSecurityHeaders(what: string, headers: Headers) {
  expect(headers.get("x-content-type-options"), what).toBe("nosniff");
  expect(headers.get("referrer-policy"), what).toBe("same-origin");
  expect(headers.get("permissions-policy"), what).toContain("camera=()");
  expect(headers.get("x-frame-options"), what).toBe("DENY");
  const policy = headers.get("content-security-policy") ?? "";
  expect(policy, what).toContain("frame-ancestors 'none'");
  expect(policy, what).not.toContain("unsafe-eval");
  // Served over http in the tests: no HSTS (tests/unit/security-headers.test.ts covers https).
  expect(headers.get("strict-transport-security"), what).toBeNull();
}

describe("headers on every kind of response", () => {
  const scientist = new HttpSession(baseUrl);
  beforeAll(async () => {
    expect((await scientist.signIn("scientist@example.com")).signedIn).toBe(true);
  });

  it("pages, API answers, static files, 404s and redirects", async () => {
    const signIn = await scientist.fetch("/sign-in");
    const html = await signIn.text();
    const asset = html.match(/src="(\/_next\/static\/[^"]+\.js)"/)?.[1];
    expect(asset).toBeDefined();
    const nonce = signIn.headers.get("content-security-policy")?.match(/'nonce-([^']+)'/)?.[1];
    expect(nonce).toBeTruthy();
    // Every script Next.js wrote carries this response's nonce.
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);

    const answers: [string, Answer][] = [
      ["sign-in page", signIn],
      ["home page", await scientist.fetch("/")],
      ["static script", await scientist.fetch(asset!)],
      ["icon", await scientist.fetch("/icon.svg")],
      ["page 404", await scientist.fetch("/no-such-page")],
      ["missing static file", await scientist.fetch("/_next/static/chunks/missing.js")],
      ["redirect to sign-in", await new HttpSession(baseUrl).fetch("/sessions")],
      ["GET /api/me", await scientist.fetch("/api/me")],
      ["GET /api/me signed out", await new HttpSession(baseUrl).fetch("/api/me")],
      ["API 404", await scientist.fetch("/api/nothing-here")],
      [
        "API POST with a body",
        await scientist.fetch("/api/tests", {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: "{}",
        }),
      ],
      ["next-auth session", await scientist.fetch("/api/auth/session")],
    ];
    const statuses = Object.fromEntries(answers.map(([what, a]) => [what, a.status]));
    expect(statuses).toMatchObject({
      "sign-in page": 200,
      "home page": 200,
      "static script": 200,
      "page 404": 404,
      "redirect to sign-in": 307,
      "GET /api/me": 200,
      "API 404": 404,
      "API POST with a body": 422,
    });
    for (const [what, answer] of answers) {
      expectSecurityHeaders(what, answer.headers);
      if (what.includes("API") || what.includes("api") || what.includes("next-auth"))
        expect(answer.headers.get("cache-control"), what).toContain("no-store");
    }
    // A page's policy is per request; API answers load nothing.
    expect((await scientist.fetch("/")).headers.get("content-security-policy")).not.toContain(nonce!);
    expect((await scientist.fetch("/api/me")).headers.get("content-security-policy")).toContain("default-src 'none'");
  });
});

describe("methods an address does not take", () => {
  it("a GET-only API route: HEAD and OPTIONS work, TRACE and PATCH get 405 with Allow", async () => {
    const head = await raw("HEAD", "/api/me");
    expect(head.status).toBe(401);
    const options = await raw("OPTIONS", "/api/me");
    expect(options.status).toBe(204);
    expect(options.headers.get("allow")).toBe("GET, HEAD, OPTIONS");
    for (const [method, body] of [
      ["TRACE", undefined],
      ["PATCH", undefined],
      ["DELETE", undefined],
    ] as const) {
      const answer = await raw(method, "/api/me", {}, body);
      expect(answer.status, method).toBe(405);
      expect(answer.headers.get("allow"), method).toBe("GET, HEAD, OPTIONS");
      expectSecurityHeaders(`${method} /api/me`, answer.headers);
    }
    // With a body (which skips proxy.ts) the answer is the same.
    const withBody = await raw("PATCH", "/api/me", { "content-type": "application/json" }, "{}");
    expect(withBody.status).toBe(405);
    expect(withBody.headers.get("allow")).toBe("GET, HEAD, OPTIONS");
    const wrongOnWriteRoute = await raw("GET", "/api/sessions/1/results");
    expect(wrongOnWriteRoute.status).toBe(405);
    expect(wrongOnWriteRoute.headers.get("allow")).toBe("OPTIONS, PUT");
  });

  it("pages take GET and HEAD only", async () => {
    for (const method of ["TRACE", "POST", "PUT", "DELETE"]) {
      const answer = await raw(
        method,
        "/sign-in",
        method === "POST" ? { "content-type": "application/x-www-form-urlencoded" } : {},
        method === "POST" ? "a=1" : undefined,
      );
      expect(answer.status, method).toBe(405);
      expect(answer.headers.get("allow"), method).toBe("GET, HEAD");
    }
    expect((await raw("HEAD", "/sign-in")).status).toBe(200);
    // Node's own parser refuses TRACK before the app sees it.
    expect((await raw("TRACK", "/sign-in").catch(() => ({ status: 400 }) as Answer)).status).toBe(400);
  });
});

describe("the pages under the policy, in the browser", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const problems: string[] = [];
  const watch = (page: Page) => {
    page.on("console", (message: ConsoleMessage) => {
      if (message.type() === "error" && /Content[ -]Security[ -]Policy|Refused to/i.test(message.text()))
        problems.push(message.text());
    });
    page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
  };
  beforeAll(async () => {
    browser = await openBrowser();
    // Reports every violation, including ones the console would fold together.
    await browser.context.addInitScript(() => {
      document.addEventListener("securitypolicyviolation", (e) =>
        console.error(`Content-Security-Policy violation: ${e.violatedDirective} ${e.blockedURI}`),
      );
    });
  });
  afterAll(async () => browser?.close());

  const hydrated = (page: Page) =>
    page.waitForFunction(() => Boolean((window as unknown as { next?: { version?: string } }).next?.version));

  it("sign-in, home, Session sheet and Import run as a scientist with no violation", async () => {
    const page = await browser.context.newPage();
    watch(page);
    await page.goto(`${baseUrl}/sign-in`);
    await hydrated(page);
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await hydrated(page);
    await page
      .getByRole("link", { name: /Sessions/ })
      .first()
      .waitFor();

    const http = new HttpSession(baseUrl);
    await http.signIn("scientist@example.com");
    const { json } = await http.json("/api/sessions");
    const session = (json.sessions as { id: number; status: string }[]).find((s) => s.status === "draft")!;

    await page.goto(`${baseUrl}/sessions/${session.id}`);
    await page.getByRole("heading", { name: "Session sheet" }).waitFor();
    await hydrated(page);
    await page.goto(`${baseUrl}/sessions/${session.id}/import`);
    await page.getByRole("heading", { name: "Import", exact: true }).waitFor();
    await hydrated(page);
    await page.goto(`${baseUrl}/no-such-page`);
    await page.getByRole("heading", { name: "Nothing here" }).waitFor();
    await hydrated(page);
    await screenshot(page, "csp-not-found");
    expect(problems).toEqual([]);
    await page.close();
  });

  it("no other site can frame the sign-in page", async () => {
    const page = await browser.context.newPage();
    const blocked: string[] = [];
    page.on("console", (m) => blocked.push(m.text()));
    await page.setContent(`<iframe src="${baseUrl}/sign-in"></iframe>`);
    await page.waitForTimeout(1000);
    const framed = page.frames().find((f) => f.url().includes("/sign-in"));
    const rendered = framed ? await framed.evaluate(() => document.body?.textContent ?? "").catch(() => "") : "";
    expect(rendered).not.toContain("Sign in");
    await page.close();
  });
});
