import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { reliabilityStudies, tests } from "@/db/schema";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import { formatDate } from "@/lib/labels";
import { buildReliabilityReport, type ReliabilityInput } from "@/lib/reports/reliability-report";
import { asReportRow, readTwoTrialFile, TwoTrialFileError } from "@/lib/reports/two-trial-file";
import { StatsInputError } from "@/lib/stats";
import type { ReliabilityFileInput, ReliabilityQuery, TypicalErrorAdoptInput } from "@/lib/validation/reports";
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
  return {
    test: testFigures(test),
    sessions: { first, second },
    file: null,
    ...buildOrRefuse({ test, rows, confidence: query.confidence }),
  };
}

/** The Reliability check of a two-trial file, scored in one of the organisation's tests. */
export async function getReliabilityFromFile(actor: Actor, input: ReliabilityFileInput) {
  const test = await loadTest(actor, input.testId);
  const rows = readFileOrRefuse(input.csv).map(asReportRow);
  return {
    test: testFigures(test),
    sessions: null,
    file: { name: input.fileName, rows: rows.length },
    ...buildOrRefuse({ test, rows, confidence: input.confidence }),
  };
}

function readFileOrRefuse(csv: string) {
  try {
    return readTwoTrialFile(csv).rows;
  } catch (error) {
    if (error instanceof TwoTrialFileError) throw invalidInput(error.message, { csv: error.message }, error.rows);
    throw error;
  }
}

function buildOrRefuse(input: ReliabilityInput) {
  try {
    return buildReliabilityReport(input);
  } catch (error) {
    if (error instanceof StatsInputError) throw invalidInput(error.message);
    throw error;
  }
}

/** What the screen shows of the test: its unit and decimals, and the typical error it holds now. */
function testFigures(test: Awaited<ReturnType<typeof loadTest>>) {
  const { swcMethod: _m, swcValue: _v, cvPercent: _cv, ...shown } = test;
  return shown;
}

/** How an adopted typical error names where it came from, e.g. "Measured: Senior Women, 24 Aug 2026 & 27 Aug 2026, n = 12". */
export function measuredSource(squadName: string, firstDate: string, secondDate: string, n: number) {
  return `Measured: ${squadName}, ${formatDate(firstDate)} & ${formatDate(secondDate)}, n = ${n}`;
}

/** The same for a two-trial file, e.g. "Measured: file “pilot.csv”, adopted 2 Dec 2026, n = 14". */
export function measuredFileSource(fileName: string, adoptedOn: Date, n: number) {
  return `Measured: file “${fileName}”, adopted ${formatDate(adoptedOn.toISOString().slice(0, 10))}, n = ${n}`;
}

/** Recomputes the study to adopt, from its sessions' stored scores or from its file. */
async function studyToAdopt(actor: Actor, testId: number, input: TypicalErrorAdoptInput) {
  if ("csv" in input) {
    const study = await getReliabilityFromFile(actor, { testId, confidence: 0.95, ...input });
    return { study, source: measuredFileSource(input.fileName, new Date(), study.n), sessions: null };
  }
  const study = await getReliabilityReport(actor, { testId, ...input, confidence: 0.95 });
  const { first, second } = study.sessions;
  return {
    study,
    source: measuredSource(first.squadName, first.date, second.date, study.n),
    sessions: { first, second },
  };
}

/**
 * Makes the typical error measured between two sessions, or in a two-trial file, the test's own.
 * The study is recomputed here from the stored scores or the file's text, never taken from the
 * client's figures, and kept in reliability_studies.
 */
export async function adoptTypicalError(actor: Actor, testId: number, input: TypicalErrorAdoptInput) {
  const { study, source, sessions } = await studyToAdopt(actor, testId, input);
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
    const { pairs: _pairs, excluded: _excluded, test: _test, sessions: _s, file: _f, ...figures } = study;
    await tx.insert(reliabilityStudies).values({
      organizationId: actor.organizationId,
      testId,
      firstSessionId: sessions?.first.id ?? null,
      secondSessionId: sessions?.second.id ?? null,
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
