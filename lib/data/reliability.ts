import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { reliabilityStudies, tests } from "@/db/schema";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import { formatDate } from "@/lib/labels";
import { buildReliabilityReport } from "@/lib/reports/reliability-report";
import { StatsInputError } from "@/lib/stats";
import type { ReliabilityQuery, TypicalErrorAdoptInput } from "@/lib/validation/reports";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { assertInBattery, loadRows, loadTest, sessionFields } from "./reports";
import { findSessionInScope } from "./scope";
import { testColumns } from "./tests";

/** The Reliability check of one test between two sessions of one squad (see lib/reports/reliability-report.ts). */
export async function getReliabilityReport(actor: Actor, query: ReliabilityQuery) {
  const db = getDb();
  const [first, second, test] = await Promise.all([
    findSessionInScope(db, actor, query.firstSessionId, sessionFields),
    findSessionInScope(db, actor, query.secondSessionId, sessionFields),
    loadTest(actor, query.testId),
  ]);
  if (first.squadId !== second.squadId)
    throw invalidInput("A reliability study retests the same athletes: pick two sessions of one squad.", {
      secondSessionId: "Another squad's session.",
    });
  await assertInBattery([first.id, second.id], test.id);
  const rows = await loadRows(actor, first.squadId, first.id, second.id, test.id);
  try {
    const report = buildReliabilityReport({ test, rows, confidence: query.confidence });
    return {
      test: {
        id: test.id,
        name: test.name,
        unit: test.unit,
        decimals: test.decimals,
        direction: test.direction,
        typicalError: test.typicalError,
        typicalErrorDf: test.typicalErrorDf,
        typicalErrorSource: test.typicalErrorSource,
        version: test.version,
      },
      sessions: { first, second },
      ...report,
    };
  } catch (error) {
    if (error instanceof StatsInputError) throw invalidInput(error.message);
    throw error;
  }
}

/** How an adopted typical error names where it came from, e.g. "Measured: Senior Women, 24 Aug 2026 & 27 Aug 2026, n = 12". */
export function measuredSource(squadName: string, firstDate: string, secondDate: string, n: number) {
  return `Measured: ${squadName}, ${formatDate(firstDate)} & ${formatDate(secondDate)}, n = ${n}`;
}

/**
 * Makes the typical error measured between two sessions the test's own. The study is recomputed
 * here from the stored scores, never taken from the client, and kept in reliability_studies.
 */
export async function adoptTypicalError(actor: Actor, testId: number, input: TypicalErrorAdoptInput) {
  const study = await getReliabilityReport(actor, { testId, ...input, confidence: 0.95 });
  const { first, second } = study.sessions;
  const source = measuredSource(first.squadName, first.date, second.date, study.n);
  return writeTransaction(async (tx) => {
    const [before] = await tx
      .select(testColumns)
      .from(tests)
      .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)));
    if (!before) throw notFound("Test");
    const [row] = await tx
      .update(tests)
      .set({
        typicalError: study.typicalError,
        typicalErrorDf: study.df,
        typicalErrorSource: source,
        version: before.version + 1,
      })
      .where(and(eq(tests.id, testId), eq(tests.version, before.version)))
      .returning(testColumns);
    if (!row) throw conflict("Someone else changed this test just now. Try again.");
    const { pairs: _pairs, excluded: _excluded, test: _test, ...figures } = study;
    await tx.insert(reliabilityStudies).values({
      organizationId: actor.organizationId,
      testId,
      firstSessionId: first.id,
      secondSessionId: second.id,
      label: source,
      n: study.n,
      typicalError: study.typicalError,
      typicalErrorDf: study.df,
      cvPercent: study.cvPercent,
      icc31: study.icc31,
      icc21: study.icc21,
      summary: { ...figures, pairs: study.pairs },
      adoptedAt: new Date(),
      createdBy: actor.userId,
    });
    await recordAudit(tx, actor, { action: "test.update", entity: { type: "test", id: testId }, before, after: row });
    return row;
  });
}
