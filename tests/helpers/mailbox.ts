/**
 * The local mail fake for integration tests: a real smtp-server on a random port writing .eml
 * files, and readers for what landed (the links mailed for invitations and resets).
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { sendQueuedMail } from "@/lib/data/mail";
import { readEml } from "@/lib/mail/eml";
import { startMailFake } from "@/scripts/mail-fake.mjs";

export async function openMailbox() {
  const dir = mkdtempSync(join(tmpdir(), "changewise-mailbox-"));
  const fake = await startMailFake({ dir });
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String(fake.port);
  process.env.MAIL_FROM = "Changewise test <no-reply@example.com>";
  const read = () =>
    readdirSync(dir)
      .sort()
      .map((name) => readEml(readFileSync(join(dir, name), "utf8")));
  return {
    dir,
    /** Every message delivered so far, oldest first (after sending whatever is queued). */
    async messages() {
      // A run already under way (started by a route) may have picked its batch before the
      // latest mail was queued: wait for it, then run until nothing is left.
      await sendQueuedMail();
      while ((await sendQueuedMail()) > 0);
      return read();
    },
    /** The newest message to this address. */
    async latestTo(address: string) {
      const found = (await this.messages()).filter((m) => m.to.includes(address));
      const latest = found.at(-1);
      if (!latest) throw new Error(`No mail to ${address}`);
      return latest;
    },
    async close() {
      await fake.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The one-time token in a mailed link (`/invitations/<token>` or `/reset-password/<token>`). */
export function tokenIn(text: string | null, path: "invitations" | "reset-password"): string {
  const match = new RegExp(`/${path}/([A-Za-z0-9_-]{43})`).exec(text ?? "");
  if (!match) throw new Error(`No ${path} link in the mail`);
  return match[1];
}
