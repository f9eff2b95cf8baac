/** Reads what the local mail fake of the browser-test server captured (.eml files in its folder). */
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { type ReadMessage, readEml } from "@/lib/mail/eml";

/** Waits for the newest message to `to` whose subject matches; mail is sent just after the request commits. */
export async function waitForMail(dir: string, to: string, subject: RegExp, timeoutMs = 15_000): Promise<ReadMessage> {
  const started = Date.now();
  for (;;) {
    const names = readdirSync(dir, { withFileTypes: true })
      .filter((e) => e.isFile() && e.name.endsWith(".eml"))
      .map((e) => e.name)
      .sort()
      .reverse();
    for (const name of names) {
      const message = readEml(readFileSync(join(dir, name), "utf8"));
      if (message.to.includes(to) && subject.test(message.subject)) return message;
    }
    if (Date.now() - started > timeoutMs)
      throw new Error(`No mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The link in a mail's text part that leads to this path. */
export function linkIn(message: ReadMessage, path: "invitations" | "reset-password"): string {
  const match = new RegExp(`https?://\\S+/${path}/[A-Za-z0-9_-]{43}`).exec(message.text ?? "");
  if (!match) throw new Error(`No ${path} link in “${message.subject}”`);
  return match[0];
}
