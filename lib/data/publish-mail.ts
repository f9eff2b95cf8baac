/**
 * Publishing a session to its athletes: who sees their results and who gets the "your new
 * results are in" mail, one per athlete, holding that athlete's own numbers and nobody else's.
 */
import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { getDb, type Reader, type Transaction } from "@/db/client";
import { athletes, results, sessionTests, testingSessions, tests, users } from "@/db/schema";
import { checkConsent, todayIso } from "@/lib/consent";
import type { Phase } from "@/lib/domain";
import { formatDate, PHASE_LABELS } from "@/lib/labels";
import { appOrigin } from "@/lib/mail/config";
import { changeNote, scoreWords } from "@/lib/words/progress";
import type { Actor } from "./actors";
import { queueMail } from "./mail";
import { findSessionInScope } from "./scope";
import { scoreCheck } from "./score-check";
import { earlierScores } from "./suspects";

export type PublishSession = { id: number; date: string; phase: Phase; publishedAt: Date | null };

/**
 * Every athlete with a result in the session: account or not, consent on `onDate` (the publish
 * day), and whether their results changed since the session was last published.
 *
 * Publishing again after "back to draft" mails only athletes with a result saved after the
 * previous publication (`results.updated_at` > `published_at`), saying their results were
 * updated; everyone else already had a mail with these very numbers. An athlete whose consent
 * was recorded only after the first publication is not mailed for it then: the mail is a
 * notice, and My progress shows them the results as soon as the consent is there.
 */
export async function publishAudience(reader: Reader, actor: Actor, session: PublishSession, onDate: string) {
  const rows = await reader
    .select({
      id: athletes.id,
      name: athletes.name,
      dateOfBirth: athletes.dateOfBirth,
      consentRecordedOn: athletes.consentRecordedOn,
      guardianConsentOn: athletes.guardianConsentOn,
      email: users.email,
      lastSaved: sql<number>`max(${results.updatedAt})`,
    })
    .from(results)
    .innerJoin(athletes, eq(athletes.id, results.athleteId))
    .leftJoin(users, eq(users.id, athletes.userId))
    .where(and(eq(results.sessionId, session.id), eq(results.organizationId, actor.organizationId)))
    .groupBy(athletes.id)
    .orderBy(asc(athletes.name));
  const since = session.publishedAt?.getTime() ?? null;
  return rows.map(({ dateOfBirth, consentRecordedOn, guardianConsentOn, lastSaved, ...a }) => {
    const consent = checkConsent({ dateOfBirth, consentRecordedOn, guardianConsentOn }, onDate);
    const changed = since === null || Number(lastSaved) > since;
    return { ...a, consent, changed, mail: consent.ok && a.email !== null && changed };
  });
}

/**
 * The publish dialog's view of the audience (owner, scientist): who will see their results and
 * get mail if the session is published today, and why not — names and reasons, never an address.
 */
export async function getPublishCheck(actor: Actor, sessionId: number) {
  const db = getDb();
  const session = await findSessionInScope(db, actor, sessionId, {
    id: testingSessions.id,
    squadId: testingSessions.squadId,
    date: testingSessions.date,
    phase: testingSessions.phase,
    status: testingSessions.status,
    publishedAt: testingSessions.publishedAt,
  });
  const onDate = todayIso();
  const [audience, scores] = await Promise.all([
    publishAudience(db, actor, session, onDate),
    scoreCheck(db, actor, session),
  ]);
  return {
    ...scores,
    status: session.status,
    republishing: session.publishedAt !== null,
    onDate,
    athletes: audience.map(({ email, ...a }) => ({ ...a, hasAccount: email !== null })),
  };
}

/**
 * Queues one mail per athlete who has an account, the needed consent and (when publishing
 * again) changed results, inside the publishing transaction. Returns how many were queued.
 */
export async function queueResultsMail(tx: Transaction, actor: Actor, session: PublishSession, onDate: string) {
  const recipients = (await publishAudience(tx, actor, session, onDate)).filter((a) => a.mail);
  if (recipients.length === 0) return 0;
  const ids = recipients.map((r) => r.id);
  const [own, earlier] = await Promise.all([
    tx
      .select({
        athleteId: results.athleteId,
        testId: tests.id,
        test: tests.name,
        unit: tests.unit,
        decimals: tests.decimals,
        direction: tests.direction,
        value: results.value,
        flag: results.flag,
      })
      .from(results)
      .innerJoin(tests, eq(tests.id, results.testId))
      .innerJoin(
        sessionTests,
        and(eq(sessionTests.sessionId, results.sessionId), eq(sessionTests.testId, results.testId)),
      )
      .where(
        and(
          eq(results.sessionId, session.id),
          eq(results.organizationId, actor.organizationId),
          inArray(results.athleteId, ids),
        ),
      )
      .orderBy(asc(sessionTests.position)),
    // Each athlete's own earlier published scores, for "since …"; newest first, so the first per test wins.
    earlierScores(tx, actor.organizationId, session, ids),
  ]);
  const previous = new Map<string, { value: number; date: string }>();
  for (const e of earlier) {
    const key = `${e.athleteId}:${e.testId}`;
    if (!previous.has(key)) previous.set(key, { value: e.value!, date: e.date });
  }

  const sessionLabel = `${PHASE_LABELS[session.phase]} testing on ${formatDate(session.date)}`;
  let queued = 0;
  for (const athlete of recipients) {
    const lines = own
      .filter((r) => r.athleteId === athlete.id && (r.value !== null || r.flag !== null))
      .map((r) => {
        const before = r.value !== null && !r.flag ? previous.get(`${athlete.id}:${r.testId}`) : undefined;
        return {
          test: r.test,
          value: scoreWords(r.value, r.flag, r.decimals, r.unit),
          ...(before
            ? {
                note: changeNote({
                  testName: r.test,
                  unit: r.unit,
                  decimals: r.decimals,
                  direction: r.direction,
                  change: r.value! - before.value,
                  previousDate: before.date,
                }),
              }
            : {}),
        };
      });
    if (lines.length === 0) continue;
    await queueMail(tx, {
      to: athlete.email!,
      organizationId: actor.organizationId,
      mail: {
        kind: "results-published",
        data: {
          athleteName: athlete.name,
          organizationName: actor.organizationName,
          sessionLabel,
          lines,
          link: `${appOrigin()}/`,
          updated: session.publishedAt !== null,
        },
      },
    });
    queued++;
  }
  return queued;
}
