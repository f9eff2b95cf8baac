/** Results of a session: the rows the Session sheet reads, and its batch saves. */
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { type Reader, type Transaction as Tx, writeTransaction } from "@/db/client";
import { athletes, results, sessionTests, testingSessions, tests, users } from "@/db/schema";
import { canEditSession } from "@/lib/auth/permissions";
import type { ResultFlag } from "@/lib/domain";
import { ApiError, conflict, forbidden, invalidInput, type RowError } from "@/lib/errors";
import { reduceTrials, trimTrials } from "@/lib/trials";
import type { ResultWriteInput } from "@/lib/validation/sessions";
import type { Actor } from "./actors";
import { type ResultSnapshot, recordAudit } from "./audit";
import { findSessionInScope, onSessionSheet } from "./scope";

export type ResultRow = {
  id: number;
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  value: number | null;
  flag: ResultFlag | null;
  note: string | null;
  version: number;
  updatedAt: number;
  updatedByName: string | null;
};

const key = (athleteId: number, testId: number) => `${athleteId}:${testId}`;

/** A session's results (or some athletes' of them); the caller has checked the session is in reach. */
export async function listResultRows(
  reader: Reader,
  actor: Actor,
  sessionId: number,
  athleteIds?: number[],
): Promise<ResultRow[]> {
  const inSession = and(eq(results.sessionId, sessionId), eq(results.organizationId, actor.organizationId));
  const where = athleteIds ? and(inSession, inArray(results.athleteId, athleteIds)) : inSession;
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

/** The session, if the caller reaches it and may change its results. */
export async function loadWritableSession(tx: Tx, actor: Actor, sessionId: number) {
  const session = await findSessionInScope(tx, actor, sessionId, {
    id: testingSessions.id,
    status: testingSessions.status,
    squadId: testingSessions.squadId,
  });
  if (!canEditSession(actor, session.status)) {
    throw forbidden("This session is published; ask a sport scientist to correct a result.");
  }
  return session;
}

async function validateWrites(
  tx: Tx,
  organizationId: number,
  session: { id: number; squadId: number },
  inputs: ResultWriteInput[],
) {
  const battery = await tx
    .select({
      id: tests.id,
      name: tests.name,
      trialRule: tests.trialRule,
      direction: tests.direction,
      trialsPerSession: tests.trialsPerSession,
    })
    .from(sessionTests)
    .innerJoin(tests, eq(tests.id, sessionTests.testId))
    .where(eq(sessionTests.sessionId, session.id));
  const testById = new Map(battery.map((t) => [t.id, t]));
  const athleteIds = [...new Set(inputs.map((i) => i.athleteId))];
  const onSheet = new Set(
    (
      await tx
        .select({ id: athletes.id })
        .from(athletes)
        .where(
          and(inArray(athletes.id, athleteIds), eq(athletes.organizationId, organizationId), onSessionSheet(session)),
        )
    ).map((r) => r.id),
  );
  // Anyone else is not found, as a record outside reach would be: whether they exist elsewhere
  // (another squad, another organisation) or not at all is never told apart.
  const missing: RowError[] = [];
  inputs.forEach((input, index) => {
    if (!onSheet.has(input.athleteId))
      missing.push({ row: index, column: "athleteId", message: "That athlete is not on this session's sheet." });
  });
  if (missing.length)
    throw new ApiError(404, "not_found", "Athlete was not found on this session's sheet. Nothing was saved.", {
      rows: missing,
    });
  const errors: RowError[] = [];
  const seen = new Set<string>();
  inputs.forEach((input, index) => {
    const test = testById.get(input.testId);
    if (!test) errors.push({ row: index, column: "testId", message: "That test is not in this session's battery." });
    else if (input.trials.length > test.trialsPerSession && trimTrials(input.trials).length > test.trialsPerSession) {
      errors.push({
        row: index,
        column: "trials",
        message: `${test.name} takes at most ${test.trialsPerSession} trials.`,
      });
    }
    const k = key(input.athleteId, input.testId);
    if (seen.has(k))
      errors.push({ row: index, column: "testId", message: "The same athlete and test appear twice in one save." });
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
    const testById = await validateWrites(tx, actor.organizationId, session, inputs);
    const athleteIds = [...new Set(inputs.map((i) => i.athleteId))];
    const current = new Map(
      (await listResultRows(tx, actor, sessionId, athleteIds)).map((r) => [key(r.athleteId, r.testId), r]),
    );

    const conflicts = inputs
      .filter((input) => (current.get(key(input.athleteId, input.testId))?.version ?? null) !== input.version)
      .map((input) => ({
        athleteId: input.athleteId,
        testId: input.testId,
        current: current.get(key(input.athleteId, input.testId)) ?? null,
      }));
    if (conflicts.length) {
      const first = conflicts[0].current;
      const who = first?.updatedByName ? `${first.updatedByName} changed it` : "It was changed";
      throw conflict(`${who} after you loaded the sheet. Nothing was saved.`, { conflicts });
    }

    const now = new Date();
    for (const input of inputs) {
      const test = testById.get(input.testId)!;
      const trials = trimTrials(input.trials);
      const values = {
        trials,
        value: reduceTrials(trials, test.trialRule, test.direction),
        flag: input.flag,
        note: input.note,
        updatedBy: actor.userId,
        updatedAt: now,
      };
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
          .values({
            ...values,
            organizationId: actor.organizationId,
            sessionId,
            athleteId: input.athleteId,
            testId: input.testId,
            version,
          })
          .returning({ id: results.id });
      }
      const snapshot = (v: number, s: Pick<ResultSnapshot, "trials" | "flag" | "note">): ResultSnapshot => ({
        athleteId: input.athleteId,
        testId: input.testId,
        ...s,
        version: v,
      });
      await recordAudit(tx, actor, {
        action: existing ? "result.update" : "result.create",
        entity: { type: "result", id },
        sessionId,
        before: existing ? snapshot(existing.version, existing) : null,
        after: snapshot(version, { trials, flag: input.flag, note: input.note }),
      });
    }
    const keys = new Set(inputs.map((i) => key(i.athleteId, i.testId)));
    return (await listResultRows(tx, actor, sessionId, athleteIds)).filter((r) => keys.has(key(r.athleteId, r.testId)));
  });
}
