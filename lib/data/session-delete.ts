/** Deleting a draft session made by mistake, with its results and raw import files. */
import "server-only";
import { and, count, eq } from "drizzle-orm";
import { writeTransaction } from "@/db/client";
import { results, testingSessions } from "@/db/schema";
import { canDeleteSession } from "@/lib/auth/permissions";
import { conflict, forbidden } from "@/lib/errors";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { findSessionInScope } from "./scope";

/**
 * Deletes the session if it is a draft the caller may delete and it still holds the number of
 * results the caller confirmed: a score saved since the confirm step stops the deletion (409)
 * rather than vanishing unseen. Results, the battery and uploads go by the foreign keys' cascade.
 */
export async function deleteDraftSession(actor: Actor, sessionId: number, confirmedResults: number) {
  return writeTransaction(async (tx) => {
    const session = await findSessionInScope(tx, actor, sessionId, {
      id: testingSessions.id,
      squadId: testingSessions.squadId,
      date: testingSessions.date,
      phase: testingSessions.phase,
      status: testingSessions.status,
      createdBy: testingSessions.createdBy,
    });
    if (!canDeleteSession(actor, session))
      throw forbidden(
        session.status === "published"
          ? "A published session cannot be deleted; take it back to draft first."
          : "Only a sport scientist, the owner or the coach who created this draft can delete it.",
      );
    const [held] = await tx.select({ n: count() }).from(results).where(eq(results.sessionId, sessionId));
    const n = held?.n ?? 0;
    if (n !== confirmedResults)
      throw conflict(
        `This session now holds ${n} ${n === 1 ? "result" : "results"}, not ${confirmedResults}. Look again before deleting.`,
        { results: n },
      );
    await tx
      .delete(testingSessions)
      .where(and(eq(testingSessions.id, sessionId), eq(testingSessions.organizationId, actor.organizationId)));
    await recordAudit(tx, actor, {
      action: "session.delete",
      entity: { type: "session", id: sessionId },
      before: { ...session, results: n },
    });
    return { id: sessionId, deletedResults: n };
  });
}
