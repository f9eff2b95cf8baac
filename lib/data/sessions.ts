import "server-only";
import { and, asc, count, desc, eq, inArray, notInArray } from "drizzle-orm";
import { getDb, type Reader, writeTransaction } from "@/db/client";
import { athletes, results, sessionTests, squads, testingSessions, tests } from "@/db/schema";
import { canDeleteSession, canEditSession, canPublish } from "@/lib/auth/permissions";
import { todayIso } from "@/lib/consent";
import { conflict, forbidden, invalidInput, notFound } from "@/lib/errors";
import type { SessionCreateInput, SessionUpdateInput } from "@/lib/validation/sessions";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { sendQueuedMail } from "./mail";
import { queueResultsMail } from "./publish-mail";
import { listResultRows } from "./results";
import { findSessionInScope, onSessionSheet, sessionScope, squadScope } from "./scope";
import { loadTypoGuard } from "./suspects";

const sessionColumns = {
  id: testingSessions.id,
  squadId: testingSessions.squadId,
  squadName: squads.name,
  date: testingSessions.date,
  phase: testingSessions.phase,
  status: testingSessions.status,
  notes: testingSessions.notes,
  version: testingSessions.version,
};

export async function listSessions(actor: Actor, { squadId }: { squadId?: number } = {}) {
  const db = getDb();
  const where = squadId ? and(sessionScope(actor), eq(testingSessions.squadId, squadId)) : sessionScope(actor);
  const rows = await db
    .select(sessionColumns)
    .from(testingSessions)
    .innerJoin(squads, eq(squads.id, testingSessions.squadId))
    .where(where)
    .orderBy(desc(testingSessions.date), desc(testingSessions.id));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [battery, counts] = await Promise.all([
    db
      .select({ sessionId: sessionTests.sessionId, testId: sessionTests.testId })
      .from(sessionTests)
      .where(inArray(sessionTests.sessionId, ids))
      .orderBy(asc(sessionTests.position)),
    db
      .select({ sessionId: results.sessionId, n: count() })
      .from(results)
      .where(and(inArray(results.sessionId, ids), eq(results.organizationId, actor.organizationId)))
      .groupBy(results.sessionId),
  ]);
  const countBy = new Map(counts.map((c) => [c.sessionId, c.n]));
  return rows.map((r) => ({
    ...r,
    testIds: battery.filter((b) => b.sessionId === r.id).map((b) => b.testId),
    resultCount: countBy.get(r.id) ?? 0,
  }));
}

/** The battery's tests must be active tests of the caller's organisation. */
async function checkBattery(db: Reader, actor: Actor, testIds: number[]) {
  const unique = [...new Set(testIds)];
  const found = await db
    .select({ id: tests.id })
    .from(tests)
    .where(and(inArray(tests.id, unique), eq(tests.organizationId, actor.organizationId), eq(tests.archived, false)));
  if (found.length !== unique.length)
    throw invalidInput("Pick tests from your test library.", { testIds: "Unknown or archived test." });
  return unique;
}

export async function createSession(actor: Actor, input: SessionCreateInput) {
  return writeTransaction(async (tx) => {
    const [squad] = await tx
      .select({ id: squads.id, archived: squads.archived })
      .from(squads)
      .where(and(eq(squads.id, input.squadId), squadScope(actor)));
    if (!squad) throw notFound("Squad");
    if (squad.archived) throw invalidInput("That squad is archived.", { squadId: "Archived squad." });
    const testIds = await checkBattery(tx, actor, input.testIds);
    const [session] = await tx
      .insert(testingSessions)
      .values({
        organizationId: actor.organizationId,
        squadId: input.squadId,
        date: input.date,
        phase: input.phase,
        notes: input.notes,
        createdBy: actor.userId,
      })
      .returning({ id: testingSessions.id });
    await tx
      .insert(sessionTests)
      .values(testIds.map((testId, position) => ({ sessionId: session.id, testId, position })));
    await recordAudit(tx, actor, {
      action: "session.create",
      entity: { type: "session", id: session.id },
      sessionId: session.id,
      after: { ...input, testIds },
    });
    return session;
  });
}

export async function sessionBattery(sessionId: number, reader: Reader = getDb()) {
  return reader
    .select({
      id: tests.id,
      name: tests.name,
      unit: tests.unit,
      decimals: tests.decimals,
      direction: tests.direction,
      trialRule: tests.trialRule,
      trialsPerSession: tests.trialsPerSession,
      plausibleMin: tests.plausibleMin,
      plausibleMax: tests.plausibleMax,
    })
    .from(sessionTests)
    .innerJoin(tests, eq(tests.id, sessionTests.testId))
    .where(eq(sessionTests.sessionId, sessionId))
    .orderBy(asc(sessionTests.position));
}

/** Everything the Session sheet needs: battery, roster (plus anyone with a result) and results. */
export async function getSessionSheet(actor: Actor, sessionId: number) {
  const db = getDb();
  // The header comes first: it is the scope check for everything read after it.
  const session = await findSessionInScope(db, actor, sessionId, {
    ...sessionColumns,
    createdBy: testingSessions.createdBy,
  });
  const [battery, resultRows, athleteList] = await Promise.all([
    sessionBattery(sessionId),
    listResultRows(db, actor, sessionId),
    // Archived athletes stay on the sheet only where they already have a result.
    db
      .select({ id: athletes.id, name: athletes.name, position: athletes.position })
      .from(athletes)
      .where(
        and(
          eq(athletes.organizationId, actor.organizationId),
          onSessionSheet({ id: sessionId, squadId: session.squadId }, { activeMembersOnly: true }),
        ),
      )
      .orderBy(asc(athletes.name)),
  ]);
  const typoGuard = await loadTypoGuard(
    db,
    actor.organizationId,
    session,
    battery.map((t) => t.id),
    athleteList.map((a) => a.id),
  );
  return {
    session,
    tests: battery,
    athletes: athleteList,
    results: resultRows,
    typoGuard,
    canEdit: canEditSession(actor, session.status),
    canPublish: canPublish(actor),
    canDelete: canDeleteSession(actor, session),
    /** Who is typing: scores kept offline in this browser are sent only under the account that typed them. */
    writerId: actor.userId,
  };
}

export async function updateSession(actor: Actor, sessionId: number, input: SessionUpdateInput) {
  const { version, testIds, ...changes } = input;
  if (changes.status && !canPublish(actor)) throw forbidden("Only a sport scientist or the owner publishes results.");
  const answer = await writeTransaction(async (tx) => {
    const { publishedAt, ...before } = await findSessionInScope(tx, actor, sessionId, {
      id: testingSessions.id,
      status: testingSessions.status,
      version: testingSessions.version,
      date: testingSessions.date,
      phase: testingSessions.phase,
      notes: testingSessions.notes,
      publishedAt: testingSessions.publishedAt,
    });
    if (!canEditSession(actor, before.status))
      throw forbidden("This session is published; ask a sport scientist to change it.");
    if (before.version !== version)
      throw conflict("Someone else changed this session since you opened it. Reload to see their change.", {
        current: before,
      });
    const publishing = changes.status === "published" && before.status !== "published";
    await tx
      .update(testingSessions)
      .set({ ...changes, version: version + 1, ...(publishing ? { publishedAt: new Date() } : {}) })
      .where(eq(testingSessions.id, sessionId));
    if (testIds) {
      const unique = await checkBattery(tx, actor, testIds);
      const [orphaned] = await tx
        .select({ n: count() })
        .from(results)
        .where(and(eq(results.sessionId, sessionId), notInArray(results.testId, unique)));
      if ((orphaned?.n ?? 0) > 0) throw conflict("A test with results in this session cannot leave its battery.");
      await tx.delete(sessionTests).where(eq(sessionTests.sessionId, sessionId));
      await tx.insert(sessionTests).values(unique.map((testId, position) => ({ sessionId, testId, position })));
    }
    // Each athlete's mail is queued with the change, so it exists exactly when the publication does.
    const mailed = publishing
      ? await queueResultsMail(
          tx,
          actor,
          { id: sessionId, date: changes.date ?? before.date, phase: changes.phase ?? before.phase, publishedAt },
          todayIso(),
        )
      : 0;
    await recordAudit(tx, actor, {
      action: publishing ? "session.publish" : "session.update",
      entity: { type: "session", id: sessionId },
      sessionId,
      before,
      after: publishing ? { ...input, mailedAthletes: mailed } : input,
    });
    return { id: sessionId, version: version + 1, ...changes, mailed };
  });
  if (answer.mailed > 0) void sendQueuedMail();
  return answer;
}
