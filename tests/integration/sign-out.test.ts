import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { BrowserJar, replaceNextHeaders } from "../helpers/auth-flow";
import { setupTestDatabase, userIdOf } from "../helpers/db";

replaceNextHeaders();

process.env.NEXTAUTH_SECRET = "integration-only-secret-0123456789";
process.env.NEXTAUTH_URL = "http://test.local";

const auth = await import("@/app/api/auth/[...nextauth]/route");
const me = await import("@/app/api/me/route");
const { endAllSessions } = await import("@/lib/data/actors");
const { pageGuard } = await import("@/lib/auth/page-guard");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
beforeAll(async () => {
  env = await setupTestDatabase();
});
afterAll(() => env.cleanup());

describe("ending a session (next-auth, JWT and guard all real)", () => {
  it("after sign-out a copied session cookie gets 401", async () => {
    const browser = new BrowserJar(auth);
    expect(await browser.signIn("coach@example.com")).toBe(true);
    expect((await browser.call(me.GET, "/api/me")).status).toBe(200);
    const stolen = browser.copy();
    expect((await stolen.call(me.GET, "/api/me")).status).toBe(200);

    expect((await browser.signOut()).status).toBe(200);
    expect(browser.signedIn).toBe(false);
    expect((await stolen.call(me.GET, "/api/me")).status).toBe(401);
  });

  it("a stale cookie sends pages to sign-in", async () => {
    const browser = new BrowserJar(auth);
    await browser.signIn("owner@example.com");
    const stolen = browser.copy();
    await browser.signOut();
    await stolen.call(me.GET, "/api/me"); // loads the copied cookie into the request
    await expect(pageGuard()).rejects.toMatchObject({ digest: expect.stringContaining("/sign-in") });
  });

  it("signing in again works, and an old cookie's sign-out does not end the new session", async () => {
    const first = new BrowserJar(auth);
    await first.signIn("scientist@example.com");
    const stolen = first.copy();
    await first.signOut();

    const again = new BrowserJar(auth);
    expect(await again.signIn("scientist@example.com")).toBe(true);
    expect((await again.call(me.GET, "/api/me")).status).toBe(200);
    await stolen.signOut();
    expect((await again.call(me.GET, "/api/me")).status).toBe(200);
  });

  it("endAllSessions (password change, reset, removal) ends every session of that user only", async () => {
    const phone = new BrowserJar(auth);
    const laptop = new BrowserJar(auth);
    const colleague = new BrowserJar(auth);
    await phone.signIn("athlete@example.com");
    await laptop.signIn("athlete@example.com");
    await colleague.signIn("owner@other.example.com");

    await endAllSessions(await userIdOf("athlete@example.com"));
    expect((await phone.call(me.GET, "/api/me")).status).toBe(401);
    expect((await laptop.call(me.GET, "/api/me")).status).toBe(401);
    expect((await colleague.call(me.GET, "/api/me")).status).toBe(200);
    expect(await phone.signIn("athlete@example.com")).toBe(true);
    expect((await phone.call(me.GET, "/api/me")).status).toBe(200);
  });
});

describe("session cookie attributes follow NEXTAUTH_URL", () => {
  async function cookiesFor(publicUrl: string) {
    vi.resetModules();
    process.env.NEXTAUTH_URL = publicUrl;
    const fresh = await import("@/app/api/auth/[...nextauth]/route");
    const browser = new BrowserJar(fresh, publicUrl);
    await browser.signIn("coach@example.com");
    return browser.setCookies.find((line) => /next-auth\.session-token=/.test(line)) ?? "";
  }

  it("is Secure (and __Secure- named) when the public URL is https", async () => {
    const line = await cookiesFor("https://club.example");
    expect(line).toMatch(/^__Secure-next-auth\.session-token=/);
    expect(line).toMatch(/;\s*Secure/i);
    expect(line).toMatch(/;\s*HttpOnly/i);
  });

  it("stays usable over plain http locally", async () => {
    const line = await cookiesFor("http://localhost:3000");
    expect(line).toMatch(/^next-auth\.session-token=/);
    expect(line).not.toMatch(/;\s*Secure/i);
  });
});
