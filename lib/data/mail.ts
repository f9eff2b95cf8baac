/**
 * The outbox: mail is queued inside the transaction of the change that causes it (an
 * invitation, a published session) and sent after the commit by `sendQueuedMail`, with retries.
 * A mail server that is down delays mail; it never loses it and never fails the request.
 */
import "server-only";
import { and, asc, desc, eq, isNull, lte } from "drizzle-orm";
import nodemailer from "nodemailer";
import { getDb, type Transaction } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { type MailConfig, mailConfig } from "@/lib/mail/config";
import { type AnyMail, renderMail } from "@/lib/mail/templates";

/** Waits between attempts: 1 min, 5 min, 15 min, then hourly. Mail is never dropped. */
const RETRY_MINUTES = [1, 5, 15, 60];
/** How long one sender holds a message before another process may try it (a crash mid-send). */
const CLAIM_MS = 2 * 60_000;
const BATCH = 20;

/**
 * Queues one mail in the caller's transaction, so it exists exactly when the change does.
 * Call `sendQueuedMail()` (not awaited) once the transaction has committed.
 */
export async function queueMail(
  tx: Transaction,
  { to, organizationId, mail }: { to: string; organizationId: number | null; mail: AnyMail },
) {
  const content = renderMail(mail);
  await tx.insert(mailOutbox).values({
    organizationId,
    kind: mail.kind,
    to,
    subject: content.subject,
    text: content.text,
    html: content.html,
    nextAttemptAt: new Date(0),
  });
}

type Sender = (message: { from: string; to: string; subject: string; text: string; html: string }) => Promise<unknown>;

function smtpSender(config: MailConfig): Sender {
  const transport = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: config.secure,
    ...(config.auth ? { auth: config.auth } : {}),
    // The local fake speaks plain SMTP on loopback; a real provider negotiates TLS itself.
    ignoreTLS: !config.secure && ["127.0.0.1", "localhost", "::1"].includes(config.host),
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return (message) => transport.sendMail(message);
}

const globalSend = globalThis as typeof globalThis & {
  __changewiseMailRun?: Promise<number>;
  __changewiseMailAgain?: boolean;
  __changewiseMailTimer?: ReturnType<typeof setInterval>;
};

/** Retries waiting mail every minute for as long as this server runs (started once, at boot). */
export function keepSendingMail() {
  if (globalSend.__changewiseMailTimer) return;
  const timer = setInterval(() => void sendQueuedMail(), 60_000);
  // A waiting retry must not keep a finished process (a script, a test) alive.
  timer.unref();
  globalSend.__changewiseMailTimer = timer;
  void sendQueuedMail();
}

/**
 * Sends every due message; returns how many went. One run at a time per process, and each
 * message is claimed before it is sent so two processes never send it twice.
 */
export function sendQueuedMail(now = () => new Date(), sender?: Sender): Promise<number> {
  const running = globalSend.__changewiseMailRun;
  if (running) {
    // That run may have picked its batch before this caller's mail was queued; without another
    // run straight after it, the mail would wait for the next minute's timer.
    globalSend.__changewiseMailAgain = true;
    return running;
  }
  const run = deliver(now, sender).finally(() => {
    globalSend.__changewiseMailRun = undefined;
    if (globalSend.__changewiseMailAgain) {
      globalSend.__changewiseMailAgain = false;
      void sendQueuedMail(now, sender);
    }
  });
  globalSend.__changewiseMailRun = run;
  // The caller does not wait: a failure is recorded on the message, never thrown at a request.
  run.catch(() => undefined);
  return run;
}

async function deliver(now: () => Date, given?: Sender): Promise<number> {
  const config = mailConfig();
  const db = getDb();
  const due = await db
    .select({ id: mailOutbox.id, attempts: mailOutbox.attempts })
    .from(mailOutbox)
    .where(and(isNull(mailOutbox.sentAt), lte(mailOutbox.nextAttemptAt, now())))
    .orderBy(asc(mailOutbox.id))
    .limit(BATCH);
  if (due.length === 0) return 0;
  if (!config && !given) {
    await Promise.all(due.map((m) => fail(m.id, m.attempts, "No mail server is set (SMTP_HOST).", now())));
    return 0;
  }
  const send = given ?? smtpSender(config!);
  const from = config?.from ?? "Changewise <no-reply@changewise.invalid>";
  let sent = 0;
  for (const { id, attempts } of due) {
    const [message] = await db
      .update(mailOutbox)
      .set({ nextAttemptAt: new Date(now().getTime() + CLAIM_MS) })
      .where(and(eq(mailOutbox.id, id), isNull(mailOutbox.sentAt), lte(mailOutbox.nextAttemptAt, now())))
      .returning({ to: mailOutbox.to, subject: mailOutbox.subject, text: mailOutbox.text, html: mailOutbox.html });
    if (!message) continue; // another process has it
    try {
      await send({
        from,
        to: message.to,
        subject: message.subject,
        text: message.text ?? "",
        html: message.html ?? "",
      });
      // The body may hold a one-time link: once delivered, it is not kept.
      await db
        .update(mailOutbox)
        .set({ sentAt: now(), attempts: attempts + 1, text: null, html: null, lastError: null })
        .where(eq(mailOutbox.id, id));
      sent++;
    } catch (error) {
      await fail(id, attempts, error instanceof Error ? error.message : String(error), now());
    }
  }
  return sent;
}

async function fail(id: number, attempts: number, reason: string, at: Date) {
  const wait = RETRY_MINUTES[Math.min(attempts, RETRY_MINUTES.length - 1)] * 60_000;
  await getDb()
    .update(mailOutbox)
    .set({ attempts: attempts + 1, lastError: reason.slice(0, 500), nextAttemptAt: new Date(at.getTime() + wait) })
    .where(eq(mailOutbox.id, id));
}

/** The organisation's recent mail and its state, for the Outbox page (no bodies: those may hold links). */
export async function listQueuedMail(organizationId: number, limit = 100) {
  return getDb()
    .select({
      id: mailOutbox.id,
      kind: mailOutbox.kind,
      to: mailOutbox.to,
      subject: mailOutbox.subject,
      attempts: mailOutbox.attempts,
      sentAt: mailOutbox.sentAt,
      nextAttemptAt: mailOutbox.nextAttemptAt,
      lastError: mailOutbox.lastError,
      createdAt: mailOutbox.createdAt,
    })
    .from(mailOutbox)
    .where(eq(mailOutbox.organizationId, organizationId))
    .orderBy(desc(mailOutbox.id))
    .limit(limit);
}
