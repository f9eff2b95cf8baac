/**
 * The Outbox page's data: the organisation's mail queue (waiting, failed attempts, sent) and,
 * when mail goes to the local fake, the messages it captured. The fake's folder is shared by
 * every organisation on the machine, so an owner sees only messages to the addresses their own
 * organisation's queue has sent to.
 */
import "server-only";
import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { notFound } from "@/lib/errors";
import { outboxDir, usesLocalFake } from "@/lib/mail/config";
import { readEml } from "@/lib/mail/eml";
import type { Actor } from "./actors";
import { listQueuedMail } from "./mail";

/** The fake names its files by time (ISO, colons replaced), so newest first is by name. */
const MESSAGE_NAME = /^[A-Za-z0-9][A-Za-z0-9._-]{0,200}\.eml$/;
const MAX_LISTED = 200;

export const isMessageName = (name: string) => MESSAGE_NAME.test(name) && !name.includes("..");

async function ownRecipients(actor: Actor) {
  const rows = await getDb()
    .selectDistinct({ to: mailOutbox.to })
    .from(mailOutbox)
    .where(eq(mailOutbox.organizationId, actor.organizationId));
  return new Set(rows.map((r) => r.to.toLowerCase()));
}

const recipientOf = (to: string) => (/<([^>]+)>/.exec(to)?.[1] ?? to).trim().toLowerCase();

async function capturedMessages(actor: Actor) {
  const dir = outboxDir();
  const names = (await readdir(dir).catch(() => [] as string[])).filter(isMessageName).sort().reverse();
  const recipients = await ownRecipients(actor);
  const listed: { id: string; to: string; subject: string; date: string }[] = [];
  for (const name of names) {
    if (listed.length >= MAX_LISTED) break;
    const raw = await readFile(join(dir, name), "utf8").catch(() => null);
    if (raw === null) continue;
    const message = readEml(raw);
    if (!recipients.has(recipientOf(message.to))) continue;
    listed.push({ id: name, to: message.to, subject: message.subject, date: message.date });
  }
  return listed;
}

/** The queue's state and, with the local fake, the captured messages newest first. */
export async function getOutbox(actor: Actor) {
  const localFake = usesLocalFake();
  const [queue, messages] = await Promise.all([
    listQueuedMail(actor.organizationId),
    localFake ? capturedMessages(actor) : Promise.resolve([]),
  ]);
  return {
    localFake,
    messages,
    queue: queue.map((m) => ({
      id: m.id,
      kind: m.kind,
      to: m.to,
      subject: m.subject,
      attempts: m.attempts,
      lastError: m.lastError,
      state: m.sentAt ? ("sent" as const) : m.attempts > 0 ? ("retrying" as const) : ("waiting" as const),
      sentAt: m.sentAt?.getTime() ?? null,
      nextAttemptAt: m.nextAttemptAt.getTime(),
      createdAt: m.createdAt.getTime(),
    })),
  };
}

/** One captured message, as text (its HTML part is not shown: it would need a frame the page's policy forbids). */
export async function getCapturedMessage(actor: Actor, id: string) {
  if (!usesLocalFake() || !isMessageName(id)) throw notFound("Message");
  const raw = await readFile(join(outboxDir(), id), "utf8").catch(() => null);
  if (raw === null) throw notFound("Message");
  const message = readEml(raw);
  if (!(await ownRecipients(actor)).has(recipientOf(message.to))) throw notFound("Message");
  return { id, from: message.from, to: message.to, subject: message.subject, date: message.date, text: message.text };
}
