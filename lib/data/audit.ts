/**
 * The audit trail: every change is recorded here, inside the transaction that makes it, so a
 * change and its record are written together or not at all. The Session sheet reads its Recent
 * changes from here, and undo finds the change it reverts.
 */
import "server-only";
import { and, desc, eq, inArray, isNull } from "drizzle-orm";
import { getDb, type Transaction as Tx } from "@/db/client";
import { athletes, auditEvents, tests, users } from "@/db/schema";
import {
  type AuditAction,
  type AuditEntityType,
  type ResultFlag,
  SHEET_AUDIT_ACTIONS,
  type SheetAuditAction,
} from "@/lib/domain";
import type { Actor } from "./actors";

/** A result as a sheet change stores it before and after, enough to show or restore it. */
export type ResultSnapshot = {
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  flag: ResultFlag | null;
  note: string | null;
  version: number;
};

export type AuditEntry = {
  action: AuditAction;
  /** `id` null: the record is gone and its id must not outlive it (a deleted athlete). */
  entity: { type: AuditEntityType; id: number | null };
  /** The session the change belongs to, so its sheet can list and undo it. */
  sessionId?: number;
  before?: unknown;
  after?: unknown;
};

export async function recordAudit(tx: Tx, actor: Actor, { action, entity, sessionId, before, after }: AuditEntry) {
  await tx.insert(auditEvents).values({
    organizationId: actor.organizationId,
    actorUserId: actor.userId,
    action,
    entityType: entity.type,
    entityId: entity.id,
    sessionId,
    before,
    after,
  });
}

/** The caller's latest sheet change in the session that is not undone yet, if any. */
export async function lastUndoableChange(tx: Tx, actor: Actor, sessionId: number) {
  const [event] = await tx
    .select({ id: auditEvents.id, before: auditEvents.before, after: auditEvents.after })
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.organizationId, actor.organizationId),
        eq(auditEvents.sessionId, sessionId),
        eq(auditEvents.actorUserId, actor.userId),
        inArray(auditEvents.action, ["result.create", "result.update"]),
        isNull(auditEvents.undoneAt),
      ),
    )
    .orderBy(desc(auditEvents.id))
    .limit(1);
  return event
    ? { id: event.id, before: event.before as ResultSnapshot | null, after: event.after as ResultSnapshot }
    : null;
}

export async function markUndone(tx: Tx, eventId: number) {
  await tx.update(auditEvents).set({ undoneAt: new Date() }).where(eq(auditEvents.id, eventId));
}

type Snapshot = Pick<ResultSnapshot, "trials" | "flag" | "note">;

/** One line of a Session sheet's Recent changes. */
export type AuditEvent = {
  id: number;
  at: number;
  action: SheetAuditAction;
  actorName: string | null;
  athleteName: string | null;
  testName: string | null;
  /** The test's decimals, so old and new scores read as the sheet writes them. */
  decimals: number | null;
  before: Snapshot | null;
  after: Snapshot | null;
  /** For a file import: what was imported. */
  details?: { filename?: string; rows?: number } | null;
  undone: boolean;
};

/** The session's recent changes, newest first, with names for people, athletes and tests. */
export async function listSessionAudit(actor: Actor, sessionId: number, limit = 50): Promise<AuditEvent[]> {
  const db = getDb();
  const events = await db
    .select({
      id: auditEvents.id,
      at: auditEvents.createdAt,
      action: auditEvents.action,
      actorName: users.name,
      before: auditEvents.before,
      after: auditEvents.after,
      undoneAt: auditEvents.undoneAt,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(
      and(
        eq(auditEvents.sessionId, sessionId),
        eq(auditEvents.organizationId, actor.organizationId),
        inArray(auditEvents.action, SHEET_AUDIT_ACTIONS),
      ),
    )
    .orderBy(desc(auditEvents.id))
    .limit(limit);
  const ref = (e: (typeof events)[number]) => ((e.after ?? e.before) as Partial<ResultSnapshot> | null) ?? null;
  const idsOf = (key: "athleteId" | "testId") => [
    ...new Set(events.map((e) => ref(e)?.[key]).filter((v): v is number => typeof v === "number")),
  ];
  const athleteIds = idsOf("athleteId");
  const testIds = idsOf("testId");
  const [athleteRows, testRows] = await Promise.all([
    athleteIds.length
      ? db
          .select({ id: athletes.id, name: athletes.name })
          .from(athletes)
          .where(and(inArray(athletes.id, athleteIds), eq(athletes.organizationId, actor.organizationId)))
      : [],
    testIds.length
      ? db
          .select({ id: tests.id, name: tests.name, decimals: tests.decimals })
          .from(tests)
          .where(and(inArray(tests.id, testIds), eq(tests.organizationId, actor.organizationId)))
      : [],
  ]);
  const athleteNames = new Map(athleteRows.map((a) => [a.id, a.name]));
  const testById = new Map(testRows.map((t) => [t.id, t]));
  const view = (v: unknown): Snapshot | null => {
    const s = v as Partial<ResultSnapshot> | null;
    return s && "trials" in s ? { trials: s.trials ?? [], flag: s.flag ?? null, note: s.note ?? null } : null;
  };
  return events.map((e) => {
    const r = ref(e);
    return {
      id: e.id,
      at: e.at.getTime(),
      action: e.action as SheetAuditAction, // the WHERE clause above admits no other
      actorName: e.actorName,
      athleteName: r?.athleteId ? (athleteNames.get(r.athleteId) ?? null) : null,
      testName: r?.testId ? (testById.get(r.testId)?.name ?? null) : null,
      decimals: r?.testId ? (testById.get(r.testId)?.decimals ?? null) : null,
      before: view(e.before),
      after: view(e.after),
      details: e.action === "results.import" ? (e.after as AuditEvent["details"]) : undefined,
      undone: e.undoneAt !== null,
    };
  });
}
