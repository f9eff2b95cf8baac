/**
 * The outbox over real SMTP: mail queued in a transaction goes to the local fake (smtp-server)
 * after the commit, a mail server that is down delays it without losing it, and mail of a
 * transaction that rolls back is never sent.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { writeTransaction } from "@/db/client";
import { mailOutbox, organizations } from "@/db/schema";
import { listQueuedMail, queueMail, sendQueuedMail } from "@/lib/data/mail";
import { readEml } from "@/lib/mail/eml";
import type { AnyMail } from "@/lib/mail/templates";
import { startMailFake } from "@/scripts/mail-fake.mjs";
import { setupTestDatabase } from "../helpers/db";

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let dir: string;
let fake: Awaited<ReturnType<typeof startMailFake>>;
let orgId = 0;

const reset = (link: string): AnyMail => ({ kind: "password-reset", data: { link, validMinutes: 60 } });
const messages = () => readdirSync(dir).map((name) => readEml(readFileSync(join(dir, name), "utf8")));
/** A port nothing listens on: a mail server that is down. */
const closedPort = () =>
  new Promise<number>((resolve) => {
    const server = createServer().listen(0, "127.0.0.1", () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });

beforeAll(async () => {
  env = await setupTestDatabase();
  dir = mkdtempSync(join(tmpdir(), "changewise-outbox-"));
  fake = await startMailFake({ dir });
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String(fake.port);
  process.env.MAIL_FROM = "Changewise test <no-reply@example.com>";
  orgId = (await env.db.select({ id: organizations.id }).from(organizations))[0].id;
});
afterAll(async () => {
  await fake.close();
  rmSync(dir, { recursive: true, force: true });
  env.cleanup();
});

describe("mail outbox", () => {
  it("sends queued mail over SMTP after the commit and keeps no body once sent", async () => {
    await writeTransaction((tx) =>
      queueMail(tx, { to: "ava@example.com", organizationId: orgId, mail: reset("http://localhost/r/one") }),
    );
    expect(await sendQueuedMail()).toBe(1);
    const [message] = messages();
    expect(message).toMatchObject({ to: "ava@example.com", subject: "Reset your Changewise password" });
    expect(message.from).toBe("Changewise test <no-reply@example.com>");
    expect(message.text).toContain("http://localhost/r/one");
    expect(message.html).toContain('href="http://localhost/r/one"');
    const [row] = await env.db.select().from(mailOutbox);
    expect(row.sentAt).toBeInstanceOf(Date);
    expect(row.text).toBeNull();
    expect(row.html).toBeNull();
    expect(await sendQueuedMail()).toBe(0);
    expect(messages()).toHaveLength(1);
  });

  it("keeps mail when the server is down, retries later, and sends it when the server is back", async () => {
    process.env.SMTP_PORT = String(await closedPort());
    await writeTransaction((tx) =>
      queueMail(tx, { to: "bea@example.com", organizationId: orgId, mail: reset("http://localhost/r/two") }),
    );
    const started = Date.now();
    expect(await sendQueuedMail()).toBe(0);
    const [waiting] = await listQueuedMail(orgId);
    expect(waiting).toMatchObject({ to: "bea@example.com", attempts: 1, sentAt: null });
    expect(waiting.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(waiting.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(started + 60_000 - 1000);
    // Not due yet: nothing is tried.
    process.env.SMTP_PORT = String(fake.port);
    expect(await sendQueuedMail()).toBe(0);
    // A minute later the retry goes through.
    expect(await sendQueuedMail(() => new Date(Date.now() + 61_000))).toBe(1);
    expect(messages().map((m) => m.to)).toContain("bea@example.com");
    const [row] = await env.db.select().from(mailOutbox).where(eq(mailOutbox.to, "bea@example.com"));
    expect(row).toMatchObject({ attempts: 2, lastError: null });
  });

  it("never sends the mail of a transaction that rolled back", async () => {
    await expect(
      writeTransaction(async (tx) => {
        await queueMail(tx, { to: "cleo@example.com", organizationId: orgId, mail: reset("http://localhost/r/3") });
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await sendQueuedMail()).toBe(0);
    expect(await env.db.select().from(mailOutbox).where(eq(mailOutbox.to, "cleo@example.com"))).toEqual([]);
  });

  it("waits, without failing anyone, when no mail server is set", async () => {
    delete process.env.SMTP_HOST;
    await writeTransaction((tx) =>
      queueMail(tx, { to: "dana@example.com", organizationId: orgId, mail: reset("http://localhost/r/4") }),
    );
    expect(await sendQueuedMail()).toBe(0);
    const [row] = await env.db.select().from(mailOutbox).where(eq(mailOutbox.to, "dana@example.com"));
    expect(row).toMatchObject({ sentAt: null, attempts: 1, lastError: "No mail server is set (SMTP_HOST)." });
    process.env.SMTP_HOST = "127.0.0.1";
  });
});
