import "server-only";
import { and, desc, eq, inArray, isNull } from "drizzle-orm";
import { getDb, writeTransaction, type Transaction as Tx } from "@/db/client";
import { athletes, auditEvents, results, sessionTests, squadAthletes, testingSessions, tests, users } from "@/db/schema";
import { conflict, forbidden, invalidInput, notFound, type RowError } from "@/lib/errors";
import { reduceTrials } from "@/lib/trials";
import type { ResultWriteInput } from "@/lib/validation/sessions";
import type { Actor } from "./actors";
import { canEditSession, sessionScope } from "./scope";

type Reader = ReturnType<typeof getDb> | Tx;

export type ResultRow = {
  id: number;
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  value: number | null;
  flag: "absent" | "injured" | "invalid" | null;
  note: string | null;
  version: number;
  updatedAt: number;
  updatedByName: string | null;
};

type Snapshot = { athleteId: number; testId: number; trials: (number | null)[]; flag: ResultRow["flag"]; note: string | null; version: number };

const key = (athleteId: number, testId: number) => `${athleteId}:${testId}`;

export async function listResultRows(sessionId: number, reader: Reader = getDb(), athleteIds?: number[]): Promise<ResultRow[]> {
  const where = athleteIds ? and(eq(results.sessionId, sessionId), inArray(results.athleteId, athleteIds)) : eq(results.sessionId, sessionId);
  const rows = await reader
    .select({
      id: results.id,
      athleteId: results.athleteId,
      testId: results.testId,
      trials: results.trials,
      value: results.value,
      flag: results.flag,
      note: results.note,
      version: results.version,
      updatedAt: results.updatedAt,
      updatedByName: users.name,
    })
    .from(results)
    .leftJoin(users, eq(users.id, results.updatedBy))
    .where(where);
  return rows.map((r) => ({ ...r, updatedAt: r.updatedAt.getTime() }));
}

/** Empty trailing slots carry no information; keeping them would make equal rows look different. */
function trimTrials(trials: (number | null)[]) {
  let end = trials.length;
  while (end > 0 && trials[end - 1] === null) end--;
  return trials.slice(0, end);
}

async function loadWritableSession(tx: Tx, actor: Actor, sessionId: number) {
  const [session] = await tx
    .select({ id: testingSessions.id, status: testingSessions.status, squadId: testingSessions.squadId })
    .from(testingSessions)
    .where(and(eq(testingSessions.id, sessionId), sessionScope(actor)));
  if (!session) throw notFound("Session");
  if (!canEditSession(actor, session.status)) {
    throw forbidden("This session is published; ask a sport scientist to correct a result.");
  }
  return session;
}

async function validateWrites(tx: Tx, session: { id: number; squadId: number }, inputs: ResultWriteInput[]) {
  const battery = await tx
    .select({ id: tests.id, name: tests.name, trialRule: tests.trialRule, direction: tests.direction, trialsPerSession: tests.trialsPerSession })
    .from(sessionTests)
    .innerJoin(tests, eq(tests.id, sessionTests.testId))
    .where(eq(sessionTests.sessionId, session.id));
  const testById = new Map(battery.map((t) => [t.id, t]));
  const athleteIds = [...new Set(inputs.map((i) => i.athleteId))];
  const onSheet = new Set([
    ...(await tx.select({ id: squadAthletes.athleteId }).from(squadAthletes).where(and(eq(squadAthletes.squadId, session.squadId), inArray(squadAthletes.athleteId, athleteIds)))).map((r) => r.id),
    ...(await tx.select({ id: results.athleteId }).from(results).where(and(eq(results.sessionId, session.id), inArray(results.athleteId, athleteIds)))).map((r) => r.id),
  ]);
  const errors: RowError[] = [];
  const seen = new Set<string>();
  inputs.forEach((input, index) => {
    const test = testById.get(input.testId);
    if (!test) errors.push({ row: index, column: "testId", message: "That test is not in this session's battery." });
    else if (input.trials.length > test.trialsPerSession && trimTrials(input.trials).length > test.trialsPerSession) {
      errors.push({ row: index, column: "trials", message: `${test.name} takes at most ${test.trialsPerSession} trials.` });
    }
    if (!onSheet.has(input.athleteId)) errors.push({ row: index, column: "athleteId", message: "That athlete is not in this session's squad." });
    const k = key(input.athleteId, input.testId);
    if (seen.has(k)) errors.push({ row: index, column: "testId", message: "The same athlete and test appear twice in one save." });
    seen.add(k);
  });
  if (errors.length) throw invalidInput("Some results could not be saved.", undefined, errors);
  return testById;
}

/**
 * Saves a batch of Session sheet cells, all or nothing. Each write carries the version it
 * read; if any cell changed since, nothing is written and the current values come back (409).
 */
export async function writeResults(actor: Actor, sessionId: number, inputs: ResultWriteInput[]): Promise<ResultRow[]> {
  return writeTransaction(async (tx) => {
    const session = await loadWritableSession(tx, actor, sessionId);
    const testById = await validateWrites(tx, session, inputs);
    const athleteIds = [...new Set(inputs.map((i) => i.athleteId))];
    const current = new Map((await listResultRows(sessionId, tx, athleteIds)).map((r) => [key(r.athleteId, r.testId), r]));

    const conflicts = inputs
      .filter((input) => (current.get(key(input.athleteId, input.testId))?.version ?? null) !== input.version)
      .map((input) => ({ athleteId: input.athleteId, testId: input.testId, current: current.get(key(input.athleteId, input.testId)) ?? null }));
    if (conflicts.length) {
      const first = conflicts[0].current;
      const who = first?.updatedByName ? `${first.updatedByName} changed it` : "It was changed";
      throw conflict(`${who} after you loaded the sheet. Nothing was saved.`, { conflicts });
    }

    const now = new Date();
    for (const input of inputs) {
      const test = testById.get(input.testId)!;
      const trials = trimTrials(input.trials);
      const values = { trials, value: reduceTrials(trials, test.trialRule, test.direction), flag: input.flag, note: input.note, updatedBy: actor.userId, updatedAt: now };
      const existing = current.get(key(input.athleteId, input.testId));
      let id: number;
      let version: number;
      if (existing) {
        version = existing.version + 1;
        const updated = await tx
          .update(results)
          .set({ ...values, version })
          .where(and(eq(results.id, existing.id), eq(results.version, existing.version)))
          .returning({ id: results.id });
        if (updated.length === 0) throw conflict("Another save reached this cell first. Nothing was saved.");
        id = existing.id;
      } else {
        version = 1;
        [{ id }] = await tx
          .insert(results)
          .values({ ...values, organizationId: actor.organizationId, sessionId, athleteId: input.athleteId, testId: input.testId, version })
          .returning({ id: results.id });
      }
      const snapshot = (v: number, s: Pick<Snapshot, "trials" | "flag" | "note">): Snapshot => ({ athleteId: input.athleteId, testId: input.testId, ...s, version: v });
      await tx.insert(auditEvents).values({
        organizationId: actor.organizationId,
        actorUserId: actor.userId,
        action: existing ? "result.update" : "result.create",
        entityType: "result",
        entityId: id,
        sessionId,
        before: existing ? snapshot(existing.version, existing) : null,
        after: snapshot(version, { trials, flag: input.flag, note: input.note }),
      });
    }
    const keys = new Set(inputs.map((i) => key(i.athleteId, i.testId)));
    return (await listResultRows(sessionId, tx, athleteIds)).filter((r) => keys.has(key(r.athleteId, r.testId)));
  });
}

const sameContent = (a: Pick<Snapshot, "trials" | "flag" | "note">, b: Pick<Snapshot, "trials" | "flag" | "note">) =>
  JSON.stringify(a.trials) === JSON.stringify(b.trials) && a.flag === b.flag && (a.note ?? null) === (b.note ?? null);

/** Reverts the caller's last sheet change in this session, unless someone changed that cell since. */
export async function undoLastChange(actor: Actor, sessionId: number) {
  return writeTransaction(async (tx) => {
    await loadWritableSession(tx, actor, sessionId);
    const [event] = await tx
      .select({ id: auditEvents.id, entityId: auditEvents.entityId, before: auditEvents.before, after: auditEvents.after })
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.sessionId, sessionId),
          eq(auditEvents.actorUserId, actor.userId),
          eq(auditEvents.entityType, "result"),
          inArray(auditEvents.action, ["result.create", "result.update"]),
          isNull(auditEvents.undoneAt),
        ),
      )
      .orderBy(desc(auditEvents.id))
      .limit(1);
    if (!event) throw notFound("A change of yours to undo");
    const after = event.after as Snapshot;
    const before = event.before as Snapshot | null;
    const [row] = await listResultRows(sessionId, tx, [after.athleteId]).then((rows) => rows.filter((r) => r.testId === after.testId));
    // Compared by content, not version: an earlier undo bumps the version but leaves the
    // cell exactly as this change wrote it, so undo can walk back through several changes.
    if (!row || !sameContent(row, after)) {
      throw conflict(`${row?.updatedByName ?? "Someone"} changed that result after you; it was not undone.`, { current: row ?? null });
    }
    const [test] = await tx.select({ trialRule: tests.trialRule, direction: tests.direction }).from(tests).where(eq(tests.id, after.testId));
    let restored: ResultRow | null = null;
    if (before) {
      await tx
        .update(results)
        .set({ trials: before.trials, value: reduceTrials(before.trials, test.trialRule, test.direction), flag: before.flag, note: before.note, updatedBy: actor.userId, updatedAt: new Date(), version: row.version + 1 })
        .where(and(eq(results.id, row.id), eq(results.version, row.version)));
      [restored] = (await listResultRows(sessionId, tx, [after.athleteId])).filter((r) => r.testId === after.testId);
    } else {
      await tx.delete(results).where(eq(results.id, row.id));
    }
    await tx.update(auditEvents).set({ undoneAt: new Date() }).where(eq(auditEvents.id, event.id));
    await tx.insert(auditEvents).values({
      organizationId: actor.organizationId, actorUserId: actor.userId, action: "result.undo", entityType: "result", entityId: row.id, sessionId,
      before: { ...after, version: row.version }, after: restored ? { ...before!, version: restored.version } : null,
    });
    return { athleteId: after.athleteId, testId: after.testId, result: restored };
  });
}

/** The session's recent changes, newest first, with names for people, athletes and tests. */
export async function listSessionAudit(actor: Actor, sessionId: number, limit = 50) {
  const db = getDb();
  const events = await db
    .select({ id: auditEvents.id, at: auditEvents.createdAt, action: auditEvents.action, actorName: users.name, before: auditEvents.before, after: auditEvents.after, undoneAt: auditEvents.undoneAt })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(and(eq(auditEvents.sessionId, sessionId), eq(auditEvents.organizationId, actor.organizationId), inArray(auditEvents.entityType, ["result", "upload"])))
    .orderBy(desc(auditEvents.id))
    .limit(limit);
  const snap = (v: unknown) => v as Partial<Snapshot> | null;
  const athleteIds = [...new Set(events.map((e) => snap(e.after)?.athleteId ?? snap(e.before)?.athleteId).filter((v): v is number => typeof v === "number"))];
  const testIds = [...new Set(events.map((e) => snap(e.after)?.testId ?? snap(e.before)?.testId).filter((v): v is number => typeof v === "number"))];
  const athleteNames = new Map(athleteIds.length ? (await db.select({ id: athletes.id, name: athletes.name }).from(athletes).where(inArray(athletes.id, athleteIds))).map((a) => [a.id, a.name]) : []);
  const testNames = new Map(testIds.length ? (await db.select({ id: tests.id, name: tests.name }).from(tests).where(inArray(tests.id, testIds))).map((t) => [t.id, t.name]) : []);
  const view = (v: unknown) => {
    const s = snap(v);
    return s && "trials" in s ? { trials: s.trials ?? [], flag: s.flag ?? null, note: s.note ?? null } : null;
  };
  return events.map((e) => {
    const ref = snap(e.after) ?? snap(e.before);
    return {
      id: e.id,
      at: e.at.getTime(),
      action: e.action,
      actorName: e.actorName,
      athleteName: ref?.athleteId ? athleteNames.get(ref.athleteId) ?? null : null,
      testName: ref?.testId ? testNames.get(ref.testId) ?? null : null,
      before: view(e.before),
      after: view(e.after),
      details: e.action === "results.import" ? (e.after as { filename?: string; rows?: number } | null) : undefined,
      undone: e.undoneAt !== null,
    };
  });
}
