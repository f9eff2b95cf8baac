/** The whole pure pipeline: text → table → mapping → plan. No I/O. */

import { runInSlices, runToEnd, type Steps } from "./cooperative";
import { type CsvTable, readCsv } from "./csv";
import { MAX_LISTED_ERRORS } from "./limits";
import { type MappingRequest, type ResolvedMapping, resolveMapping } from "./mapping";
import { type ImportPlan, planSteps } from "./plan";
import type { ImportContext } from "./types";

export type Analysis = { table: CsvTable; resolved: ResolvedMapping; plan: ImportPlan };

function* analysisSteps(text: string, request: MappingRequest, context: ImportContext): Steps<Analysis> {
  const table = yield* readCsv(text);
  const resolved = resolveMapping(table, request, context);
  const plan = yield* planSteps(table, resolved.mapping, context);
  if (resolved.errors.length > 0) {
    // Header problems first; the listing stays as short as the plan's own, the count complete.
    plan.errors = [...resolved.errors, ...plan.errors].slice(0, MAX_LISTED_ERRORS);
    plan.errorCount += resolved.errors.length;
    plan.unknownTests = [...resolved.unknownTests, ...plan.unknownTests].slice(0, MAX_LISTED_ERRORS);
  }
  if (table.rows.length === 0) {
    if (plan.errors.length < MAX_LISTED_ERRORS)
      plan.errors.push({ row: table.headerRow + 1, message: "There are no data rows below the header." });
    plan.errorCount++;
  }
  return { table, resolved, plan };
}

/** Straight through: for tests and small inputs. */
export const analyseCsv = (text: string, request: MappingRequest, context: ImportContext): Analysis =>
  runToEnd(analysisSteps(text, request, context));

/** In slices that give the event loop a turn every few milliseconds: what a request uses. */
export const analyseCsvInSlices = (text: string, request: MappingRequest, context: ImportContext): Promise<Analysis> =>
  runInSlices(analysisSteps(text, request, context));
