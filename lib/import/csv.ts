/**
 * CSV reading, RFC 4180 style: the delimiter is read off the header line; a field in quotes may
 * hold delimiters, line breaks and doubled quotes. One pass over the text, in steps that yield
 * (see cooperative.ts), with bounded memory per row: every shape of file costs time in
 * proportion to its size, and no shape holds the event loop.
 */

import type { RowError } from "@/lib/errors";
import { runToEnd, type Steps } from "./cooperative";
import { MAX_HEADER_CHARS, MAX_IMPORT_COLUMNS, MAX_LISTED_ERRORS } from "./limits";
import type { Delimiter } from "./types";

export type CsvTable = {
  delimiter: Delimiter;
  headers: string[];
  /** Spreadsheet row number of the header: 1, unless the file starts with blank lines. */
  headerRow: number;
  /** Data rows that hold at least one non-blank cell, cells as written (not trimmed). */
  rows: string[][];
  /** Spreadsheet row number of each data row (the header is row 1; blank rows still count). */
  rowNumbers: number[];
  /** Quoting or shape problems found while splitting: the first MAX_LISTED_ERRORS of them. */
  problems: RowError[];
  /** All of them. */
  problemCount: number;
};

const CANDIDATES: Delimiter[] = [",", ";", "\t", "|"];
const QUOTE = 34;
const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;
/** Characters read between two pauses; a pause is taken only when a slice's time is up. */
const STEP_CHARS = 1 << 15;

const isSpace = (c: number) => c === SPACE || c === TAB || (c > 127 && /\s/.test(String.fromCharCode(c)));

/**
 * The delimiter that splits the header line (the first line with any content) most often,
 * outside quotes. A header names columns, so it has no decimal commas to confuse a `;` file
 * with a `,` file. Ties go to `,`. One pass: counts restart at each line that has no content.
 */
function* delimiterSteps(text: string): Steps<Delimiter> {
  const counts = [0, 0, 0, 0];
  const codes = CANDIDATES.map((d) => d.charCodeAt(0));
  let inQuotes = false;
  let content = false;
  let counted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) {
      inQuotes = !inQuotes;
      content = true;
    } else if (!inQuotes && (c === LF || c === CR)) {
      if (content) break;
      if (counted) counts.fill(0);
      counted = false;
    } else if (!inQuotes && codes.includes(c)) {
      counts[codes.indexOf(c)]++;
      counted = true;
    } else if (!content && !isSpace(c)) {
      content = true;
    }
    if ((i & (STEP_CHARS - 1)) === 0) yield;
  }
  let best = 0;
  for (let d = 1; d < CANDIDATES.length; d++) if (counts[d] > counts[best]) best = d;
  return CANDIDATES[best];
}

export const detectDelimiter = (text: string): Delimiter => runToEnd(delimiterSteps(text));

const UNCLOSED =
  'A quoted field is never closed, so the rest of the file runs into it. Close the quote (RFC 4180: a field that starts with " ends with "; a quote inside it is written twice).';
const MISPLACED =
  "A quote is misplaced. A field in quotes must end with the closing quote right before the delimiter (RFC 4180).";
const TOO_WIDE_HEADER = `The header has more than ${MAX_IMPORT_COLUMNS} columns; Changewise reads at most ${MAX_IMPORT_COLUMNS}. Remove the columns you do not need.`;
const TOO_WIDE_ROW = `This row has more than ${MAX_IMPORT_COLUMNS} cells. Check for a run of stray delimiters.`;

class Problems {
  readonly items: RowError[] = [];
  count = 0;
  add(row: number, message: string, column?: string) {
    this.count++;
    if (this.items.length < MAX_LISTED_ERRORS)
      this.items.push(column === undefined ? { row, message } : { row, column, message });
  }
}

const escapeClass = (d: Delimiter) => (d === "\t" ? "\\t" : d === "|" ? "\\|" : d);

export function* readCsv(text: string): Steps<CsvTable> {
  const delimiter = yield* delimiterSteps(text);
  const D = delimiter.charCodeAt(0);
  // The end of an unquoted field. A plain loop: a regex match would allocate an array per cell.
  const endOfField = (from: number) => {
    let at = from;
    while (at < n) {
      const c = text.charCodeAt(at);
      if (c === D || c === LF || c === CR) break;
      at++;
    }
    return at;
  };
  const n = text.length;
  const overflowTail = new RegExp(`[^${escapeClass(delimiter)} \t]`, "g");
  const lineOrQuote = /[\r\n"]/g;
  /**
   * From inside a row that is already too wide, to its line break (or the end of the text):
   * quotes that open a field are honoured, because a quoted line break does not end the row.
   */
  function* skipToRowEnd(from: number): Steps<number> {
    let at = from;
    for (;;) {
      lineOrQuote.lastIndex = at;
      const m = lineOrQuote.exec(text);
      if (!m) return n;
      if (text.charCodeAt(m.index) !== QUOTE) return m.index;
      const opensField = m.index === 0 || text.charCodeAt(m.index - 1) === D || m.index === from;
      if (!opensField) {
        at = m.index + 1;
        continue;
      }
      // Inside quotes: the next quote that is not doubled ends the field.
      let q = m.index + 1;
      for (;;) {
        q = text.indexOf('"', q);
        if (q === -1) return n;
        if (q + 1 < n && text.charCodeAt(q + 1) === QUOTE) q += 2;
        else break;
        if (q >= pauseAt) {
          pauseAt = q + STEP_CHARS;
          yield;
        }
      }
      at = q + 1;
      if (at >= pauseAt) {
        pauseAt = at + STEP_CHARS;
        yield;
      }
    }
  }
  const problems = new Problems();
  const rows: string[][] = [];
  const rowNumbers: number[] = [];
  let header: string[] | null = null;
  let headerRow = 0;

  let i = 0;
  let record = 0; // 0-based: the spreadsheet row is record + 1, blank rows included
  let cells: string[] = [];
  let blank = true;
  let overflow = false;
  let misplaced = false;
  let pauseAt = STEP_CHARS;

  for (;;) {
    let c = i < n ? text.charCodeAt(i) : -1;
    if (cells.length === 0 && (c === LF || c === CR)) {
      // A run of blank lines: counted, nothing else to do.
      while (i < n) {
        c = text.charCodeAt(i);
        if (c === LF) i++;
        else if (c === CR) i += i + 1 < n && text.charCodeAt(i + 1) === LF ? 2 : 1;
        else break;
        record++;
        if (i >= pauseAt) {
          pauseAt = i + STEP_CHARS;
          yield;
        }
      }
      if (i >= n) break;
      c = text.charCodeAt(i);
    }
    if (cells.length === MAX_IMPORT_COLUMNS && c === D) {
      // Past the kept cells only two things matter: whether any cell holds something, and where
      // the row ends. Delimiters and spaces are skipped in one search.
      overflowTail.lastIndex = i;
      const m = overflowTail.exec(text);
      i = m ? m.index : n;
      c = i < n ? text.charCodeAt(i) : -1;
      if (c !== LF && c !== CR && c !== -1) {
        overflow = true;
        i = yield* skipToRowEnd(i);
        c = i < n ? text.charCodeAt(i) : -1;
      }
      if (i >= pauseAt) {
        pauseAt = i + STEP_CHARS;
        yield;
      }
    }
    let value: string;
    if (c === QUOTE) {
      // Find the closing quote first; doubled quotes are undone in one replace at the end.
      const start = i + 1;
      let from = start;
      let doubled = false;
      let tail = "";
      let close = -1;
      for (;;) {
        const q = text.indexOf('"', from);
        if (q === -1) {
          i = n;
          problems.add(record + 1, UNCLOSED);
          break;
        }
        if (q + 1 < n && text.charCodeAt(q + 1) === QUOTE) {
          doubled = true;
          from = q + 2;
          if (from >= pauseAt) {
            pauseAt = from + STEP_CHARS;
            yield;
          }
          continue;
        }
        close = q;
        // Spaces between the closing quote and the delimiter are tolerated, as spreadsheets do.
        let j = q + 1;
        while (j < n && (text.charCodeAt(j) === SPACE || text.charCodeAt(j) === TAB) && text.charCodeAt(j) !== D) j++;
        const after = j < n ? text.charCodeAt(j) : -1;
        if (after === D || after === LF || after === CR || after === -1) {
          i = j;
        } else {
          if (!misplaced) problems.add(record + 1, MISPLACED);
          misplaced = true;
          const end = endOfField(q + 1);
          tail = `"${text.slice(q + 1, end)}`;
          i = end;
        }
        break;
      }
      const inner = text.slice(start, close === -1 ? n : close);
      // split/join: a regex replace grew faster than the field on a field of a million doubled quotes.
      value = (doubled ? inner.split('""').join('"') : inner) + tail;
      c = i < n ? text.charCodeAt(i) : -1;
    } else if (c === D || c === LF || c === CR || c === -1) {
      value = "";
    } else {
      const end = endOfField(i);
      value = text.slice(i, end);
      i = end;
      c = i < n ? text.charCodeAt(i) : -1;
    }

    const cellBlank = value === "" || value.trim() === "";
    // Cells past the limit are not kept (a 10 MB run of delimiters must not become 10 million strings).
    if (cells.length < MAX_IMPORT_COLUMNS) cells.push(value);
    else if (!cellBlank) overflow = true;
    if (!cellBlank) blank = false;

    if (c === D) {
      i++;
    } else {
      if (c === CR) i += i + 1 < n && text.charCodeAt(i + 1) === LF ? 2 : 1;
      else if (c === LF) i++;
      if (!blank) {
        if (header === null) {
          header = cells;
          headerRow = record + 1;
          if (overflow) problems.add(headerRow, TOO_WIDE_HEADER);
        } else {
          rows.push(cells);
          rowNumbers.push(record + 1);
          if (overflow) problems.add(record + 1, TOO_WIDE_ROW);
        }
      }
      record++;
      cells = [];
      blank = true;
      overflow = false;
      misplaced = false;
      if (i >= n) break;
    }
    if (i >= pauseAt) {
      pauseAt = i + STEP_CHARS;
      yield;
    }
  }

  const headers = (header ?? []).map((h, index) => {
    const name = h.trim();
    if (name.length <= MAX_HEADER_CHARS) return name;
    problems.add(
      headerRow,
      `Column ${index + 1}'s name is longer than ${MAX_HEADER_CHARS} characters. Is this the header row?`,
    );
    return name.slice(0, MAX_HEADER_CHARS);
  });
  return {
    delimiter,
    headers,
    headerRow: headerRow || 1,
    rows,
    rowNumbers,
    problems: problems.items,
    problemCount: problems.count,
  };
}

export const parseCsv = (text: string): CsvTable => runToEnd(readCsv(text));
