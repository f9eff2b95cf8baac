/**
 * CSV reading: the delimiter is read off the header line, fields are split by papaparse
 * (RFC 4180 quoting: a quoted field may hold delimiters, line breaks and doubled quotes).
 */
import Papa from "papaparse";
import type { Delimiter } from "./types";
import type { RowError } from "@/lib/errors";

export type CsvTable = {
  delimiter: Delimiter;
  headers: string[];
  /** Spreadsheet row number of the header: 1, unless the file starts with blank lines. */
  headerRow: number;
  /** Data rows that hold at least one non-blank cell, cells as written (not trimmed). */
  rows: string[][];
  /** Spreadsheet row number of each data row (the header is row 1; blank rows still count). */
  rowNumbers: number[];
  /** Quoting or shape problems found while splitting. */
  problems: RowError[];
};

const CANDIDATES: Delimiter[] = [",", ";", "\t", "|"];

/** The first line of the text, up to a line break that is not inside quotes. */
function firstLine(text: string): string {
  let inQuotes = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '"') inQuotes = !inQuotes;
    else if (!inQuotes && (c === "\n" || c === "\r")) {
      if (text.slice(0, i).trim() !== "") return text.slice(0, i);
    }
  }
  return text;
}

/**
 * The delimiter that splits the header line most often (outside quotes). A header names
 * columns, so it has no decimal commas to confuse a `;` file with a `,` file. Ties go to `,`.
 */
export function detectDelimiter(text: string): Delimiter {
  const line = firstLine(text);
  const counts = new Map<Delimiter, number>(CANDIDATES.map((d) => [d, 0]));
  let inQuotes = false;
  for (const c of line) {
    if (c === '"') inQuotes = !inQuotes;
    else if (!inQuotes && counts.has(c as Delimiter)) counts.set(c as Delimiter, counts.get(c as Delimiter)! + 1);
  }
  let best: Delimiter = ",";
  for (const d of CANDIDATES) if (counts.get(d)! > counts.get(best)!) best = d;
  return best;
}

const isBlank = (cells: string[]) => {
  for (const cell of cells) if (cell.trim() !== "") return false;
  return true;
};

export function parseCsv(text: string): CsvTable {
  const delimiter = detectDelimiter(text);
  // No quote character in the input lets papaparse take its fast path (a plain split).
  const parsed = Papa.parse<string[]>(text, { delimiter, header: false, skipEmptyLines: false, dynamicTyping: false });
  const records = parsed.data;
  const problems: RowError[] = [];
  for (const error of parsed.errors) {
    if (error.type !== "Quotes") continue;
    problems.push({
      row: (error.row ?? 0) + 1,
      message:
        error.code === "MissingQuotes"
          ? "A quoted field is never closed, so the rest of the file runs into it. Close the quote (RFC 4180: a field that starts with \" ends with \"; a quote inside it is written twice)."
          : "A quote is misplaced. A field in quotes must end with the closing quote right before the delimiter (RFC 4180).",
    });
  }

  let headerIndex = 0;
  while (headerIndex < records.length && isBlank(records[headerIndex])) headerIndex++;
  const headers = (records[headerIndex] ?? []).map((h) => h.trim());
  const rows: string[][] = [];
  const rowNumbers: number[] = [];
  for (let i = headerIndex + 1; i < records.length; i++) {
    const cells = records[i];
    if (isBlank(cells)) continue;
    rows.push(cells);
    rowNumbers.push(i + 1);
  }
  return { delimiter, headers, headerRow: headerIndex + 1, rows, rowNumbers, problems };
}
