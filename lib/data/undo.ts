import "server-only";
import { and, eq } from "drizzle-orm";
import { writeTransaction } from "@/db/client";
import { results, tests } from "@/db/schema";
import { conflict, notFound } from "@/lib/errors";
import { reduceTrials } from "@/lib/trials";
import type { Actor } from "./actors";
import { lastUndoableChange, markUndone, type ResultSnapshot, recordAudit } from "./audit";
import { listResultRows, loadWritableSession, type ResultRow } from "./results";

type Content = Pick<ResultSnapshot, "trials" | "flag" | "note">;

const sameContent = (a: Content, b: Content) =>
  JSON.stringify(a.trials) === JSON.stringify(b.trials) && a.flag === b.flag && (a.note ?? null) === (b.note ?? null);

/** Reverts the caller's last sheet change in this session, unless someone changed that cell since. */
export async function undoLastChange(actor: Actor, sessionId: number) {
  return writeTransaction(async (tx) => {
    await loadWritableSession(tx, actor, sessionId);
    const event = await lastUndoableChange(tx, actor, sessionId);
    if (!event) throw notFound("A change of yours to undo");
    const { before, after } = event;
    const cell = async () =>
      (await listResultRows(tx, actor, sessionId, [after.athleteId])).find((r) => r.testId === after.testId);
    const row = await cell();
    // Compared by content, not version: an earlier undo bumps the version but leaves the
    // cell exactly as this change wrote it, so undo can walk back through several changes.
    if (!row || !sameContent(row, after)) {
      throw conflict(`${row?.updatedByName ?? "Someone"} changed that result after you; it was not undone.`, {
        current: row ?? null,
      });
    }
    let restored: ResultRow | null = null;
    if (before) {
      const [test] = await tx
        .select({ trialRule: tests.trialRule, direction: tests.direction })
        .from(tests)
        .where(eq(tests.id, after.testId));
      await tx
        .update(results)
        .set({
          trials: before.trials,
          value: reduceTrials(before.trials, test.trialRule, test.direction),
          flag: before.flag,
          note: before.note,
          updatedBy: actor.userId,
          updatedAt: new Date(),
          version: row.version + 1,
        })
        .where(and(eq(results.id, row.id), eq(results.version, row.version)));
      restored = (await cell()) ?? null;
    } else {
      await tx.delete(results).where(eq(results.id, row.id));
    }
    await markUndone(tx, event.id);
    await recordAudit(tx, actor, {
      action: "result.undo",
      entity: { type: "result", id: row.id },
      sessionId,
      before: { ...after, version: row.version },
      after: restored && before ? { ...before, version: restored.version } : null,
    });
    return { athleteId: after.athleteId, testId: after.testId, result: restored };
  });
}
