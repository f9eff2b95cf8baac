/**
 * Deleting an athlete for real (PRODUCT.md §8: deletion is real deletion): the record and every
 * row that refers to them, in one transaction. Results, squad places, their account (unless it
 * belongs to another organisation too), invitations, the deletion request, raw import files that
 * name them, audit entries that hold their id or name, their mail; saved reports and reliability
 * studies keep their figures but lose the athlete's rows, and free text loses their name.
 * The preview counts exactly what the deletion will touch, for the confirmation dialog.
 */
import "server-only";
import { and, eq, inArray, isNotNull, like, ne, or, type SQL, sql } from "drizzle-orm";
import type { SQLiteColumn } from "drizzle-orm/sqlite-core";
import { getDb, type Reader, type Transaction, writeTransaction } from "@/db/client";
import {
  athletes,
  auditEvents,
  deletionRequests,
  invitations,
  mailOutbox,
  memberships,
  reliabilityStudies,
  results,
  savedReports,
  signInAttempts,
  squadAthletes,
  testingSessions,
  tests,
  uploads,
  users,
} from "@/db/schema";
import { notFound } from "@/lib/errors";
import { bytesMention, mentions, scrub, scrubText, type Traces, textMentions } from "@/lib/traces";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";

/** A LIKE that narrows a scan to rows that might hold one of the words (the exact check is in JS). */
const mayHold = (column: SQLiteColumn | SQL, traces: Traces, extra: string[] = []) =>
  or(...[...traces.words, ...extra].map((w) => like(sql`lower(${column})`, `%${w.toLowerCase()}%`)))!;

async function findTraces(reader: Reader, actor: Actor, athleteId: number) {
  const [athlete] = await reader
    .select({
      id: athletes.id,
      name: athletes.name,
      externalId: athletes.externalId,
      userId: athletes.userId,
      aliases: athletes.aliases,
    })
    .from(athletes)
    .where(and(eq(athletes.id, athleteId), eq(athletes.organizationId, actor.organizationId)));
  if (!athlete) throw notFound("Athlete");
  const [account] = athlete.userId
    ? await reader
        .select({ id: users.id, email: users.email, name: users.name })
        .from(users)
        .where(eq(users.id, athlete.userId))
    : [];
  const traces: Traces = {
    athleteId,
    userId: account?.id ?? null,
    // Other spellings the Import remembered name them too (in files, and in the import's audit note).
    words: [athlete.name, ...athlete.aliases, athlete.externalId, account?.email, account?.name].filter(
      (w): w is string => Boolean(w),
    ),
  };
  return { athlete, account: account ?? null, traces };
}

/** Everything the deletion will touch, found with the caller's reader (the transaction when deleting). */
async function plan(reader: Reader, actor: Actor, athleteId: number) {
  const org = actor.organizationId;
  const { athlete, account, traces } = await findTraces(reader, actor, athleteId);
  const idText = String(athleteId);
  const [
    resultRows,
    squadRows,
    otherMemberships,
    invitationRows,
    requestRows,
    uploadRows,
    auditRows,
    reportRows,
    studyRows,
    mailRows,
  ] = await Promise.all([
    reader.select({ id: results.id }).from(results).where(eq(results.athleteId, athleteId)),
    reader.select({ id: squadAthletes.squadId }).from(squadAthletes).where(eq(squadAthletes.athleteId, athleteId)),
    account
      ? reader
          .select({ id: memberships.id })
          .from(memberships)
          .where(and(eq(memberships.userId, account.id), ne(memberships.organizationId, org)))
      : [],
    reader
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(
          eq(invitations.organizationId, org),
          account
            ? or(eq(invitations.athleteId, athleteId), eq(invitations.email, account.email))!
            : eq(invitations.athleteId, athleteId),
        ),
      ),
    reader.select({ id: deletionRequests.id }).from(deletionRequests).where(eq(deletionRequests.athleteId, athleteId)),
    reader
      .select({ id: uploads.id, filename: uploads.filename, content: uploads.content })
      .from(uploads)
      .where(eq(uploads.organizationId, org)),
    reader
      .select({
        id: auditEvents.id,
        entityType: auditEvents.entityType,
        entityId: auditEvents.entityId,
        before: auditEvents.before,
        after: auditEvents.after,
      })
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.organizationId, org),
          or(
            and(eq(auditEvents.entityType, "athlete"), eq(auditEvents.entityId, athleteId)),
            account
              ? and(inArray(auditEvents.entityType, ["member", "user"]), eq(auditEvents.entityId, account.id))
              : undefined,
            like(sql`${auditEvents.before}`, `%${idText}%`),
            like(sql`${auditEvents.after}`, `%${idText}%`),
            mayHold(sql`${auditEvents.before}`, traces),
            mayHold(sql`${auditEvents.after}`, traces),
          ),
        ),
      ),
    reader
      .select({
        id: savedReports.id,
        snapshot: savedReports.snapshot,
        settings: savedReports.settings,
        note: savedReports.note,
      })
      .from(savedReports)
      .where(eq(savedReports.organizationId, org)),
    reader
      .select({ id: reliabilityStudies.id, summary: reliabilityStudies.summary, label: reliabilityStudies.label })
      .from(reliabilityStudies)
      .where(eq(reliabilityStudies.organizationId, org)),
    reader
      .select({
        id: mailOutbox.id,
        to: mailOutbox.to,
        subject: mailOutbox.subject,
        text: mailOutbox.text,
        html: mailOutbox.html,
      })
      .from(mailOutbox)
      .where(
        or(
          account ? eq(mailOutbox.to, account.email) : undefined,
          and(
            eq(mailOutbox.organizationId, org),
            or(mayHold(mailOutbox.subject, traces), mayHold(mailOutbox.text, traces), mayHold(mailOutbox.html, traces)),
          ),
        ),
      ),
  ]);
  const auditGone = auditRows.filter(
    (e) =>
      (e.entityType === "athlete" && e.entityId === athleteId) ||
      (account !== null && (e.entityType === "member" || e.entityType === "user") && e.entityId === account.id) ||
      mentions(e.before, traces) ||
      mentions(e.after, traces),
  );
  const uploadsGone = uploadRows.filter((u) => textMentions(u.filename, traces) || bytesMention(u.content, traces));
  const reportsScrubbed = reportRows.filter(
    (r) => mentions(r.snapshot, traces) || mentions(r.settings, traces) || textMentions(r.note, traces),
  );
  const studiesScrubbed = studyRows.filter(
    (s) => mentions(s.summary, traces) || (s.label !== null && textMentions(s.label, traces)),
  );
  const mailGone = mailRows.filter(
    (m) =>
      (account !== null && m.to === account.email) ||
      [m.subject, m.text, m.html].some((text) => text !== null && textMentions(text, traces)),
  );
  return {
    athlete,
    account,
    traces,
    /** The account goes with the athlete unless it belongs to another organisation as well. */
    accountFate: account ? (otherMemberships.length > 0 ? ("kept-elsewhere" as const) : ("deleted" as const)) : null,
    results: resultRows.map((r) => r.id),
    squads: squadRows.map((r) => r.id),
    invitations: invitationRows.map((r) => r.id),
    requests: requestRows.map((r) => r.id),
    uploads: uploadsGone.map((u) => u.id),
    audit: auditGone.map((e) => e.id),
    reports: reportsScrubbed,
    studies: studiesScrubbed,
    mail: mailGone.map((m) => m.id),
  };
}

type Plan = Awaited<ReturnType<typeof plan>>;

const countsOf = (p: Plan) => ({
  results: p.results.length,
  squads: p.squads.length,
  account: p.accountFate,
  invitations: p.invitations.length,
  deletionRequests: p.requests.length,
  uploads: p.uploads.length,
  auditEntries: p.audit.length,
  savedReports: p.reports.length,
  reliabilityStudies: p.studies.length,
  mails: p.mail.length,
});

/** What deleting the athlete would remove, for the owner's confirmation. */
export async function previewAthleteDeletion(actor: Actor, athleteId: number) {
  const p = await plan(getDb(), actor, athleteId);
  return { athlete: { id: p.athlete.id, name: p.athlete.name }, counts: countsOf(p) };
}

export type DeletionPreview = Awaited<ReturnType<typeof previewAthleteDeletion>>;

/** Free-text columns of the organisation's own rows where staff may have written the athlete's name. */
async function scrubFreeText(tx: Transaction, actor: Actor, traces: Traces) {
  const org = actor.organizationId;
  const targets = [
    {
      table: testingSessions,
      id: testingSessions.id,
      column: testingSessions.notes,
      key: "notes",
      org: testingSessions.organizationId,
    },
    { table: results, id: results.id, column: results.note, key: "note", org: results.organizationId },
    { table: athletes, id: athletes.id, column: athletes.notes, key: "notes", org: athletes.organizationId },
    {
      table: tests,
      id: tests.id,
      column: tests.typicalErrorSource,
      key: "typicalErrorSource",
      org: tests.organizationId,
    },
  ] as const;
  let changed = 0;
  for (const target of targets) {
    const rows = await tx
      .select({ id: target.id, text: target.column })
      .from(target.table)
      .where(and(eq(target.org, org), isNotNull(target.column), mayHold(target.column, traces)));
    for (const row of rows) {
      if (row.text === null || !textMentions(row.text, traces)) continue;
      await tx
        .update(target.table)
        .set({ [target.key]: scrubText(row.text, traces) })
        .where(eq(target.id, row.id));
      changed++;
    }
  }
  return changed;
}

/** Deletes the athlete and every trace of them, in one transaction; returns what went. */
export async function deleteAthlete(actor: Actor, athleteId: number) {
  return writeTransaction(async (tx) => {
    const p = await plan(tx, actor, athleteId);
    const { traces } = p;
    const inIds = <T extends SQLiteColumn>(column: T, ids: number[]) => inArray(column, ids.length ? ids : [0]);
    await tx.delete(results).where(eq(results.athleteId, athleteId));
    await tx.delete(squadAthletes).where(eq(squadAthletes.athleteId, athleteId));
    await tx.delete(invitations).where(inIds(invitations.id, p.invitations));
    await tx.delete(deletionRequests).where(eq(deletionRequests.athleteId, athleteId));
    await tx.delete(uploads).where(inIds(uploads.id, p.uploads));
    await tx.delete(auditEvents).where(inIds(auditEvents.id, p.audit));
    await tx.delete(mailOutbox).where(inIds(mailOutbox.id, p.mail));
    for (const report of p.reports)
      await tx
        .update(savedReports)
        .set({
          snapshot: scrub(report.snapshot, traces) as Record<string, unknown>,
          settings: scrub(report.settings, traces) as Record<string, unknown>,
          note: scrubText(report.note, traces),
        })
        .where(eq(savedReports.id, report.id));
    for (const study of p.studies)
      await tx
        .update(reliabilityStudies)
        .set({
          summary: scrub(study.summary, traces) as Record<string, unknown> | null,
          label: study.label === null ? null : scrubText(study.label, traces),
        })
        .where(eq(reliabilityStudies.id, study.id));
    const notes = await scrubFreeText(tx, actor, traces);
    await tx.delete(athletes).where(eq(athletes.id, athleteId));
    if (p.account) {
      await tx
        .delete(signInAttempts)
        .where(inArray(signInAttempts.email, [p.account.email, `reset:${p.account.email}`]));
      if (p.accountFate === "deleted") await tx.delete(users).where(eq(users.id, p.account.id));
      else
        await tx
          .delete(memberships)
          .where(and(eq(memberships.userId, p.account.id), eq(memberships.organizationId, actor.organizationId)));
    }
    const counts = { ...countsOf(p), notes };
    // The record of the deletion names nobody: the athlete's id must not outlive them either.
    await recordAudit(tx, actor, { action: "athlete.delete", entity: { type: "athlete", id: null }, after: counts });
    return counts;
  });
}
