/**
 * Password reset through the real sign-in (next-auth, JWT, guard): the request answers the same
 * for any address, the mailed link works once for an hour, and using it ends every other session.
 * Also: an accepted invitation signs in through the same credentials flow.
 */
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditEvents, mailOutbox, passwordResetTokens } from "@/db/schema";
import { BrowserJar, replaceNextHeaders } from "../helpers/auth-flow";
import { setupTestDatabase, userIdOf } from "../helpers/db";
import { openMailbox, tokenIn } from "../helpers/mailbox";
import { call } from "../helpers/session";

replaceNextHeaders();

process.env.NEXTAUTH_SECRET = "integration-only-secret-0123456789";
process.env.NEXTAUTH_URL = "http://test.local";

const auth = await import("@/app/api/auth/[...nextauth]/route");
const me = await import("@/app/api/me/route");
const resetRoute = await import("@/app/api/password-reset/route");
const confirmRoute = await import("@/app/api/password-reset/confirm/route");
const { MAX_RESETS_PER_EMAIL } = await import("@/lib/auth/throttle");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let mailbox: Awaited<ReturnType<typeof openMailbox>>;
beforeAll(async () => {
  env = await setupTestDatabase();
  mailbox = await openMailbox();
});
afterAll(async () => {
  await mailbox.close();
  env.cleanup();
});

const ask = (email: unknown, headers: Record<string, string> = {}) =>
  call(resetRoute.POST, { method: "POST", body: { email }, headers });
const confirm = (token: string, password: string) =>
  call(confirmRoute.POST, { method: "POST", body: { token, password } });
const resetMails = async (to: string) =>
  (await mailbox.messages()).filter((m) => m.to === to && m.subject === "Reset your Changewise password");

describe("password reset", () => {
  it("answers the same whether or not the address has an account; only a member gets a mail", async () => {
    const known = await ask("coach@example.com");
    const unknown = await ask("nobody-here@example.com");
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(known.status);
    expect(unknown.json).toEqual(known.json);
    expect(await resetMails("coach@example.com")).toHaveLength(1);
    expect(await resetMails("nobody-here@example.com")).toHaveLength(0);
    expect((await env.db.select().from(mailOutbox)).map((m) => m.to)).not.toContain("nobody-here@example.com");
  });

  it("bad input is 422, never a 500", async () => {
    for (const email of ["", "no-at-sign", 7, null]) expect((await ask(email)).status).toBe(422);
  });

  it("stores the token hashed, for an hour; the link sets the password once and ends every other session", async () => {
    const browser = new BrowserJar(auth);
    expect(await browser.signIn("scientist@example.com")).toBe(true);
    const elsewhere = browser.copy();
    expect((await elsewhere.call(me.GET, "/api/me")).status).toBe(200);

    await ask("scientist@example.com");
    const token = tokenIn((await resetMails("scientist@example.com")).at(-1)!.text, "reset-password");
    const userId = await userIdOf("scientist@example.com");
    const [stored] = await env.db.select().from(passwordResetTokens).where(eq(passwordResetTokens.userId, userId));
    expect(stored.tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    const minutes = (stored.expiresAt.getTime() - stored.createdAt.getTime()) / 60_000;
    expect(minutes).toBeGreaterThan(59.9);
    expect(minutes).toBeLessThan(60.1);

    const done = await confirm(token, "a-brand-new-password");
    expect(done.status).toBe(200);
    expect(done.json.reset).toEqual({ email: "scientist@example.com" });
    // Every session issued before is over, on every device.
    expect((await elsewhere.call(me.GET, "/api/me")).status).toBe(401);
    expect((await browser.call(me.GET, "/api/me")).status).toBe(401);
    // The old password is gone, the new one signs in.
    expect(await new BrowserJar(auth).signIn("scientist@example.com")).toBe(false);
    const fresh = new BrowserJar(auth);
    expect(await fresh.signIn("scientist@example.com", "a-brand-new-password")).toBe(true);
    expect((await fresh.call(me.GET, "/api/me")).status).toBe(200);
    // Single use.
    const again = await confirm(token, "yet-another-password");
    expect(again.status).toBe(404);
    expect(again.json.error.message).toMatch(/used already/);
    const [used] = await env.db.select().from(passwordResetTokens).where(eq(passwordResetTokens.id, stored.id));
    expect(used.usedAt).toBeInstanceOf(Date);
    // The audit records the reset, never the token or its hash.
    const audit = JSON.stringify(
      await env.db.select().from(auditEvents).where(eq(auditEvents.action, "password.reset")),
    );
    expect(audit).toContain("password.reset");
    expect(audit).not.toContain(token);
    expect(audit).not.toContain(stored.tokenHash);
  });

  it("an expired link is refused (410) and changes nothing", async () => {
    await ask("coach2@example.com");
    const token = tokenIn((await resetMails("coach2@example.com")).at(-1)!.text, "reset-password");
    await env.db
      .update(passwordResetTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(passwordResetTokens.userId, await userIdOf("coach2@example.com")));
    const late = await confirm(token, "too-late-password");
    expect(late.status).toBe(410);
    expect(await new BrowserJar(auth).signIn("coach2@example.com")).toBe(true);
  });

  it("a newer link replaces the older one", async () => {
    await ask("athlete@example.com");
    const older = tokenIn((await resetMails("athlete@example.com")).at(-1)!.text, "reset-password");
    await ask("athlete@example.com");
    const newer = tokenIn((await resetMails("athlete@example.com")).at(-1)!.text, "reset-password");
    expect(newer).not.toBe(older);
    expect((await confirm(older, "athlete-new-password")).status).toBe(404);
    expect((await confirm(newer, "athlete-new-password")).status).toBe(200);
  });

  it("throttles: a few mails per account, then the same answer without a mail; an address asking too often is held", async () => {
    const before = (await resetMails("owner@example.com")).length;
    const answers = [];
    for (let i = 0; i < MAX_RESETS_PER_EMAIL + 2; i++) answers.push(await ask("owner@example.com"));
    expect(new Set(answers.map((a) => `${a.status} ${JSON.stringify(a.json)}`)).size).toBe(1);
    expect((await resetMails("owner@example.com")).length - before).toBe(MAX_RESETS_PER_EMAIL);

    process.env.TRUST_PROXY = "1";
    try {
      const from = { "x-forwarded-for": "203.0.113.9" };
      const statuses = [];
      for (let i = 0; i < 12; i++) statuses.push((await ask(`someone-${i}@example.com`, from)).status);
      expect(statuses.slice(0, 10).every((s) => s === 202)).toBe(true);
      expect(statuses.slice(10)).toEqual([429, 429]);
      // Another address is not held.
      expect((await ask("someone@example.com", { "x-forwarded-for": "203.0.113.10" })).status).toBe(202);
    } finally {
      delete process.env.TRUST_PROXY;
    }
  });
});
