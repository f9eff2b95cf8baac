/**
 * The mapping step: the reading of the header chosen in the UI (or suggested), checked against
 * the file's columns and the session's battery. Problems land on the header row.
 */

import { MAX_TRIALS } from "@/lib/domain";
import type { RowError } from "@/lib/errors";
import {
  detectFormat,
  findAthleteColumn,
  findLongColumns,
  normaliseName,
  parseTrialHeader,
  suggestWideColumns,
} from "./columns";
import type { CsvTable } from "./csv";
import { suggestionsFor } from "./suggest";
import type {
  ImportContext,
  ImportFormat,
  ImportMapping,
  ImportTest,
  LongColumns,
  UnknownTest,
  WideColumnSuggestion,
  WideTarget,
} from "./types";

/** What the caller may choose; anything left out is suggested from the header. */
export type MappingRequest = {
  format?: ImportFormat;
  athleteColumn?: string;
  testColumn?: string;
  trialColumn?: string;
  valueColumn?: string;
  /** Wide only: every column to read, header → { testId, trial } or null to ignore. Columns not named are ignored. */
  columns?: Record<string, WideTarget>;
};

export type ResolvedMapping = {
  detectedFormat: ImportFormat;
  mapping: ImportMapping;
  /** The suggested reading of each column (wide files), for the mapping step. */
  suggestions: WideColumnSuggestion[];
  /** The long-format columns found in the header, for the mapping step. */
  suggestedLong: LongColumns;
  errors: RowError[];
  unknownTests: UnknownTest[];
};

export const trialLimit = (trialsPerSession: number) => Math.max(1, Math.min(trialsPerSession, MAX_TRIALS));

const quote = (s: string) => `“${s}”`;

export function resolveMapping(table: CsvTable, request: MappingRequest, context: ImportContext): ResolvedMapping {
  const { headers, headerRow: row } = table;
  const errors: RowError[] = [];
  const unknownTests: UnknownTest[] = [];
  const detectedFormat = detectFormat(headers);
  const format = request.format ?? detectedFormat;
  const suggestedLong = findLongColumns(headers);
  const has = (column: string) => headers.includes(column);

  if (headers.filter((h) => h !== "").length < 2) {
    errors.push({
      row,
      message: `The header has only one column (${quote(headers[0] ?? "")}). Changewise reads columns separated by , ; tab or |; check the first line holds column names such as athlete,test,trial,value.`,
    });
  }
  const seen = new Map<string, number>();
  headers.forEach((header, index) => {
    if (header === "") return;
    const key = normaliseName(header);
    const first = seen.get(key);
    if (first === undefined) seen.set(key, index);
    else {
      errors.push({
        row,
        column: header,
        message: `Columns ${first + 1} and ${index + 1} are both headed ${quote(header)}. Give each column its own name, e.g. ${quote(`${header} 1`)} and ${quote(`${header} 2`)}.`,
      });
    }
  });

  const athleteGuess =
    request.athleteColumn ?? (format === "long" ? suggestedLong.athlete : findAthleteColumn(headers));
  const suggestions = suggestWideColumns(headers, context, athleteGuess);

  if (format === "long") {
    const columns: LongColumns = {
      athlete: request.athleteColumn ?? suggestedLong.athlete,
      test: request.testColumn ?? suggestedLong.test,
      trial: request.trialColumn === undefined ? suggestedLong.trial : request.trialColumn || null,
      value: request.valueColumn ?? suggestedLong.value,
    };
    const required: [keyof LongColumns, string][] = [
      ["athlete", "the athlete"],
      ["test", "the test"],
      ["value", "the score"],
    ];
    for (const [key, what] of required) {
      const column = columns[key];
      if (column === null) {
        errors.push({
          row,
          message: `No column holds ${what}. Head it ${quote(key)} (long format: athlete,test,trial,value) or choose it in the mapping step.`,
        });
      }
    }
    for (const column of Object.values(columns)) {
      if (column !== null && !has(column))
        errors.push({ row, column, message: `This file has no column ${quote(column)}.` });
    }
    return { detectedFormat, mapping: { format, columns }, suggestions, suggestedLong, errors, unknownTests };
  }

  const athleteColumn = athleteGuess;
  if (athleteColumn === null) {
    errors.push({
      row,
      message:
        "No column names the athlete. Head the first column “athlete” (name or external id), or choose it in the mapping step.",
    });
  } else if (!has(athleteColumn)) {
    errors.push({ row, column: athleteColumn, message: `This file has no column ${quote(athleteColumn)}.` });
  }

  // A mapping sent from the mapping step names the columns someone chose (null: ignore it); every
  // other column is read as the header suggests, so a column nobody has looked at is never
  // dropped without a word: it is read, or reported.
  const columns: Record<string, WideTarget> = {};
  const testsById = new Map(context.tests.map((t) => [t.id, t]));
  const targetOwner = new Map<string, string>();
  const chosen = request.columns ?? {};
  /**
   * Reads `header` as the test's trial, if the test takes that trial and no other column is read
   * as it already; otherwise says why on the header row, worded for a choice or for a suggestion.
   */
  const claim = (header: string, test: ImportTest, trial: number, how: "chosen" | "suggested") => {
    const limit = trialLimit(test.trialsPerSession);
    if (!Number.isInteger(trial) || trial < 1 || trial > limit) {
      errors.push({
        row,
        column: header,
        message:
          how === "chosen"
            ? `${test.name} takes trials 1 to ${limit} in a session; ${quote(header)} is mapped to trial ${trial}.`
            : `${test.name} takes trials 1 to ${limit} in a session; this column reads as trial ${trial}. Map it to a trial in the mapping step, or ignore it.`,
      });
      return;
    }
    const key = `${test.id}:${trial}`;
    const other = targetOwner.get(key);
    if (other !== undefined) {
      errors.push({
        row,
        column: header,
        message:
          how === "chosen"
            ? `Columns ${quote(other)} and ${quote(header)} are both mapped to ${test.name} trial ${trial}.`
            : `Columns ${quote(other)} and ${quote(header)} both read as ${test.name} trial ${trial}. Rename one, or map them in the mapping step.`,
      });
      return;
    }
    targetOwner.set(key, header);
    columns[header] = { testId: test.id, trial };
  };
  for (const [header, target] of Object.entries(chosen)) {
    if (!has(header)) {
      errors.push({ row, column: header, message: `This file has no column ${quote(header)}.` });
      continue;
    }
    if (header === athleteColumn) continue;
    if (target === null) {
      columns[header] = null;
      continue;
    }
    const test = testsById.get(target.testId);
    if (!test) {
      errors.push({
        row,
        column: header,
        message: `Column ${quote(header)} is mapped to a test that is not in this session's battery.`,
      });
      continue;
    }
    claim(header, test, target.trial, "chosen");
  }
  // "CMJ 1", "CMJ 2", "CMJ 3" are one unknown test, named as the file names it.
  const unknownByName = new Map<string, UnknownTest>();
  for (const s of suggestions) {
    if (s.status === "athlete" || s.header === athleteColumn || s.header in chosen) continue;
    if (s.status === "unknown" || s.status === "not-in-battery") {
      const name = parseTrialHeader(s.header)?.name ?? s.header.trim();
      const key = normaliseName(name);
      const known = unknownByName.get(key);
      if (known) known.count++;
      else {
        const entry: UnknownTest = { name, reason: s.status, count: 1, rows: [row], column: s.header };
        if (s.status === "unknown") entry.suggestions = suggestionsFor(name, context.tests);
        unknownByName.set(key, entry);
        unknownTests.push(entry);
      }
      errors.push({
        row,
        column: s.header,
        message:
          s.status === "unknown"
            ? `No test in the Test library is called ${quote(s.header)}. Match it above (Names in the file), map or ignore the column in the mapping step, or rename the column.`
            : `${quote(s.header)} is in the Test library but not in this session's battery. Add it to the battery, or ignore the column.`,
      });
      continue;
    }
    if (s.status !== "matched") {
      columns[s.header] = null;
      continue;
    }
    claim(s.header, testsById.get(s.testId!)!, s.trial!, "suggested");
  }
  if (!Object.values(columns).some((t) => t !== null) && !errors.some((e) => e.column)) {
    errors.push({
      row,
      message:
        "No column is read as a test of this session's battery. Head the columns with test names (e.g. “Countermovement jump 1”), or map them in the mapping step.",
    });
  }
  return {
    detectedFormat,
    mapping: { format: "wide", athleteColumn, columns },
    suggestions,
    suggestedLong,
    errors,
    unknownTests,
  };
}
