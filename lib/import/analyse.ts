/** The whole pure pipeline: text → table → mapping → plan. No I/O. */
import { parseCsv, type CsvTable } from "./csv";
import { resolveMapping, type MappingRequest, type ResolvedMapping } from "./mapping";
import { buildPlan, type ImportPlan } from "./plan";
import type { ImportContext } from "./types";

export type Analysis = { table: CsvTable; resolved: ResolvedMapping; plan: ImportPlan };

export function analyseCsv(text: string, request: MappingRequest, context: ImportContext): Analysis {
  const table = parseCsv(text);
  const resolved = resolveMapping(table, request, context);
  const plan = buildPlan(table, resolved.mapping, context);
  if (resolved.errors.length > 0) {
    plan.errors = [...resolved.errors, ...plan.errors];
    plan.errorCount += resolved.errors.length;
    plan.unknownTests = [...resolved.unknownTests, ...plan.unknownTests];
  }
  if (table.rows.length === 0) {
    plan.errors.push({ row: table.headerRow + 1, message: "There are no data rows below the header." });
    plan.errorCount++;
  }
  return { table, resolved, plan };
}
