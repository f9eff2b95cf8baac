/**
 * A two-trial file for the Reliability check: one row per athlete, two scores of one test taken a
 * few days apart. It lets a scientist check a test with data collected before Changewise (a pilot,
 * a colleague's study) without entering it as sessions. Same number rules as the Import.
 */

import type { RowError } from "@/lib/errors";
import { parseCsv } from "@/lib/import/csv";
import { parseScore } from "@/lib/import/numbers";
import type { ReportRow } from "./change-report";

/** More rows than any retest study; a bigger paste is almost certainly the wrong file. */
export const MAX_TWO_TRIAL_ROWS = 2000;

export type TwoTrialRow = { row: number; label: string; first: number | null; second: number | null };

/** Why a two-trial file cannot be read, with the spreadsheet row of each problem. */
export class TwoTrialFileError extends Error {
  constructor(
    message: string,
    readonly rows: RowError[] = [],
  ) {
    super(message);
    this.name = "TwoTrialFileError";
  }
}

const isScore = (cell: string | undefined, delimiter: Parameters<typeof parseScore>[1]) =>
  cell !== undefined && typeof parseScore(cell, delimiter) === "number";

/**
 * Reads the file's rows. Columns: athlete, first trial, second trial — or only the two trials,
 * when the rows are then called "Row 2", "Row 3"… A header row is optional: a first line whose
 * score cells are numbers is data. Rows with neither score are skipped; a row with one score is
 * kept, so the report can list it as left out.
 *
 * @example readTwoTrialFile("athlete;day 1;day 2\nAva;31,2;30,8").rows // [{ row: 2, label: "Ava", first: 31.2, second: 30.8 }]
 * @throws {TwoTrialFileError} for a wrong number of columns, a cell that is not a number, a
 * quoting problem, or more than MAX_TWO_TRIAL_ROWS rows
 */
export function readTwoTrialFile(text: string): { rows: TwoTrialRow[] } {
  const table = parseCsv(text);
  if (table.problems.length > 0) throw new TwoTrialFileError("The file could not be split into rows.", table.problems);
  const width = table.headers.length;
  if (width === 0 && table.rows.length === 0) throw new TwoTrialFileError("The file is empty.");
  if (width !== 2 && width !== 3)
    throw new TwoTrialFileError(
      `A two-trial file has three columns (athlete, first trial, second trial) or two (the trials); this one has ${width}.`,
    );
  const scoreColumns = width === 3 ? [1, 2] : [0, 1];
  const headerIsData = scoreColumns.every((c) => isScore(table.headers[c], table.delimiter));
  const lines = headerIsData
    ? [
        { cells: table.headers, row: table.headerRow },
        ...table.rows.map((cells, i) => ({ cells, row: table.rowNumbers[i] })),
      ]
    : table.rows.map((cells, i) => ({ cells, row: table.rowNumbers[i] }));
  if (lines.length > MAX_TWO_TRIAL_ROWS)
    throw new TwoTrialFileError(
      `The file has ${lines.length} rows; a two-trial file holds at most ${MAX_TWO_TRIAL_ROWS}.`,
    );

  const columnName = (c: number) => (headerIsData ? `column ${c + 1}` : table.headers[c] || `column ${c + 1}`);
  const problems: RowError[] = [];
  const rows: TwoTrialRow[] = [];
  for (const { cells, row } of lines) {
    const [first, second] = scoreColumns.map((c) => {
      const parsed = parseScore(cells[c] ?? "", table.delimiter);
      if (typeof parsed === "string") problems.push({ row, column: columnName(c), message: parsed });
      return typeof parsed === "number" ? parsed : null;
    });
    if (first === null && second === null) continue;
    const label = width === 3 ? (cells[0] ?? "").trim().slice(0, 80) : "";
    rows.push({ row, label: label || `Row ${row}`, first, second });
  }
  if (problems.length > 0)
    throw new TwoTrialFileError(
      problems.length === 1 ? "One score is not a number." : `${problems.length} scores are not numbers.`,
      problems.slice(0, 50),
    );
  if (rows.length === 0) throw new TwoTrialFileError("The file holds no scores.");
  return { rows };
}

/** A file row as the report builders see an athlete: first trial as `pre`, second as `post`. */
export function asReportRow({ row, label, first, second }: TwoTrialRow): ReportRow {
  return {
    athleteId: row,
    name: label,
    pre: first === null ? null : { value: first, flag: null },
    post: second === null ? null : { value: second, flag: null },
  };
}
