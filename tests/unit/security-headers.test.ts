/** Security headers: the static set (next.config.ts), the per-request ones (proxy.ts) and the API's (withApi). */
import { NextRequest } from "next/server";
import { afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { json, withApi } from "@/lib/api/handler";
import { contentSecurityPolicy } from "@/lib/security/headers";
import nextConfig from "@/next.config";
import { proxy } from "@/proxy";

beforeAll(() => {
  process.env.NEXTAUTH_SECRET = "unit-test-secret-0123456789-0123456789";
});
afterEach(() => vi.unstubAllEnvs());

const request = (path: string, method = "GET") => new NextRequest(`http://test.local${path}`, { method });
const nonceOf = (policy: string | null) => policy?.match(/'nonce-([^']+)'/)?.[1];

describe("next.config.ts headers (every response)", () => {
  it("sets the static headers and a policy without inline scripts everywhere, no-store on the API", async () => {
    const rules = await nextConfig.headers!();
    const all = Object.fromEntries(rules.find((r) => r.source === "/:path*")!.headers.map((h) => [h.key, h.value]));
    expect(all).toMatchObject({
      "X-Content-Type-Options": "nosniff",
      "Referrer-Policy": "same-origin",
      "X-Frame-Options": "DENY",
      "Permissions-Policy": expect.stringContaining("camera=()"),
    });
    expect(all["Content-Security-Policy"]).toContain("frame-ancestors 'none'");
    expect(all["Content-Security-Policy"]).not.toMatch(
      /unsafe-eval|'unsafe-inline'[^;]*;.*script|script-src[^;]*unsafe-inline/,
    );
    const api = Object.fromEntries(rules.find((r) => r.source === "/api/:path*")!.headers.map((h) => [h.key, h.value]));
    expect(api["Cache-Control"]).toBe("no-store");
    expect(api["Content-Security-Policy"]).toContain("default-src 'none'");
  });
});

describe("the page policy", () => {
  it("runs scripts only with the nonce; eval only in development", () => {
    const production = contentSecurityPolicy({ nonce: "abc" });
    expect(production).toContain("script-src 'self' 'nonce-abc' 'strict-dynamic'");
    expect(production).not.toContain("unsafe-eval");
    expect(production).toContain("frame-ancestors 'none'");
    expect(production).toContain("object-src 'none'");
    expect(contentSecurityPolicy({ nonce: "abc", dev: true })).toContain("'unsafe-eval'");
    expect(contentSecurityPolicy({ https: true })).toContain("upgrade-insecure-requests");
  });
});

describe("proxy.ts", () => {
  it("gives each page its own nonce, in the response and in the request Next.js renders", async () => {
    const first = await proxy(request("/sign-in"));
    const second = await proxy(request("/sign-in"));
    const policy = first.headers.get("content-security-policy");
    expect(first.headers.get("x-middleware-next")).toBe("1");
    expect(nonceOf(policy)).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(nonceOf(second.headers.get("content-security-policy"))).not.toBe(nonceOf(policy));
    expect(first.headers.get("x-middleware-request-content-security-policy")).toBe(policy);
    expect(policy).not.toContain("unsafe-eval");
  });

  it("sends signed-out visitors to sign-in with the headers on the redirect", async () => {
    const response = await proxy(request("/sessions/3"));
    expect(response.status).toBe(307);
    expect(response.headers.get("location")).toBe("http://test.local/sign-in?next=%2Fsessions%2F3");
    expect(response.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
  });

  it("adds HSTS only when the public URL is https", async () => {
    vi.stubEnv("NEXTAUTH_URL", "http://localhost:3000");
    expect((await proxy(request("/sign-in"))).headers.get("strict-transport-security")).toBeNull();
    vi.stubEnv("NEXTAUTH_URL", "https://club.example");
    for (const path of ["/sign-in", "/", "/api/me", "/_next/static/chunks/x.js"]) {
      expect((await proxy(request(path))).headers.get("strict-transport-security"), path).toMatch(
        /^max-age=\d{8,}; includeSubDomains$/,
      );
    }
    expect((await proxy(request("/sign-in"))).headers.get("content-security-policy")).toContain(
      "upgrade-insecure-requests",
    );
  });

  it("marks API answers no-store", async () => {
    const response = await proxy(request("/api/me"));
    expect(response.headers.get("x-middleware-next")).toBe("1");
    expect(response.headers.get("cache-control")).toBe("no-store");
  });

  it("answers 405 with Allow for methods an address does not take", async () => {
    // TRACE and TRACK cannot reach proxy.ts at all (tests/unit/refuse-methods.test.ts).
    expect(() => request("/", "TRACE")).toThrow(/unsupported/);
    for (const method of ["PATCH", "DELETE", "PUT", "PROPFIND"]) {
      const api = await proxy(request("/api/me", method));
      expect(api.status, method).toBe(405);
      expect(api.headers.get("allow")).toBe("GET, HEAD, OPTIONS");
      expect((await api.json()).error.code).toBe("method_not_allowed");
      const page = await proxy(request("/sign-in", method));
      expect(page.status, method).toBe(405);
      expect(page.headers.get("allow")).toBe("GET, HEAD");
    }
    for (const method of ["GET", "HEAD", "OPTIONS"])
      expect((await proxy(request("/api/me", method))).headers.get("x-middleware-next"), method).toBe("1");
    expect((await proxy(request("/api/sessions/4/results", "GET"))).headers.get("allow")).toBe("OPTIONS, PUT");
  });

  it("answers unknown API addresses with the API's 404", async () => {
    const response = await proxy(request("/api/nothing-here"));
    expect(response.status).toBe(404);
    expect((await response.json()).error.code).toBe("not_found");
  });
});

describe("withApi", () => {
  it("marks every API answer no-store, errors included, and adds HSTS over https", async () => {
    vi.stubEnv("NEXTAUTH_URL", "https://club.example");
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const ok = await withApi(async () => json({ ok: true }))(new Request("http://test.local/api/x"), {
      params: Promise.resolve({}),
    });
    const failed = await withApi(async () => {
      throw new Error("boom");
    })(new Request("http://test.local/api/x"), { params: Promise.resolve({}) });
    for (const response of [ok, failed]) {
      expect(response.headers.get("cache-control")).toBe("no-store");
      expect(response.headers.get("strict-transport-security")).toContain("max-age=");
      expect(response.headers.get("content-security-policy")).toContain("default-src 'none'");
    }
    log.mockRestore();
  });
});
