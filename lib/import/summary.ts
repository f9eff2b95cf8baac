/** The answers of the import API, shared by the route handler and the Import page. */

import type { RowError } from "@/lib/errors";
import type { Suspect } from "@/lib/suspect";
import type { Replacement } from "./merge";
import type { PreviewValue } from "./plan";
import type {
  Delimiter,
  ImportContext,
  ImportCounts,
  ImportFormat,
  ImportMapping,
  LeftOut,
  LongColumns,
  UnknownAthlete,
  UnknownTest,
  WideColumnSuggestion,
} from "./types";

export type ReplacementRow = RowError & {
  athleteName: string;
  testName: string;
  trial: number | null;
  previous: number | null;
  previousFlag: string | null;
  next: number | null;
};

export type ImportPreview = {
  mode: "preview";
  /** Scores the typo guard doubts (lib/suspect.ts): they import all the same, after a look. */
  suspects: Suspect[];
  file: { name: string; size: number };
  format: ImportFormat;
  detectedFormat: ImportFormat;
  delimiter: Delimiter;
  /** True when a comma inside a value is read as a decimal comma (files not separated by commas). */
  decimalComma: boolean;
  headers: string[];
  headerRow: number;
  /** The mapping this preview was read with (suggested, or the one sent). */
  mapping: ImportMapping;
  /** How each column reads on its own (wide), for the mapping step. */
  suggestions: WideColumnSuggestion[];
  /** The long-format columns found in the header. */
  longColumns: LongColumns;
  rowCount: number;
  sample: { row: number; cells: string[] }[];
  parsed: PreviewValue[];
  unknownAthletes: UnknownAthlete[];
  unknownAthleteCount: number;
  unknownTests: UnknownTest[];
  /** Rows left out as asked in the mapping step, by name. */
  leftOut: LeftOut[];
  errors: RowError[];
  errorCount: number;
  warnings: RowError[];
  warningCount: number;
  counts: ImportCounts;
  replacements: ReplacementRow[];
  canCommit: boolean;
  tests: { id: number; name: string; unit: string; decimals: number; trialsPerSession: number }[];
  /** The roster the file is read against, for matching a name the file spells its own way. */
  roster: { id: number; name: string }[];
};

export type ImportCommitted = {
  mode: "commit";
  suspects: Suspect[];
  uploadId: number;
  filename: string;
  format: ImportFormat;
  rowsImported: number;
  counts: ImportCounts;
  leftOut: LeftOut[];
  /** Matches kept as other names of athletes and tests, for the next import. */
  remembered: { kind: "athlete" | "test"; value: string; id: number; name: string }[];
  /** Matches asked to be remembered that were not, and why. */
  unremembered: { kind: "athlete" | "test"; value: string; reason: string }[];
};

const fmt = (v: number | null) => (v === null ? "empty" : String(v));

export function describeReplacements(
  replacements: Replacement[],
  context: ImportContext,
  limit: number,
): ReplacementRow[] {
  const athletes = new Map(context.athletes.map((a) => [a.id, a.name]));
  const tests = new Map(context.tests.map((t) => [t.id, t]));
  return replacements.slice(0, limit).map((r) => {
    const athleteName = athletes.get(r.athleteId) ?? `athlete ${r.athleteId}`;
    const test = tests.get(r.testId);
    const testName = test?.name ?? `test ${r.testId}`;
    const unit = test ? ` ${test.unit}` : "";
    const message =
      r.trial === null
        ? `${athleteName}'s ${testName} is marked “${r.previousFlag}”; importing scores would clear that mark.`
        : `Replaces ${athleteName}'s ${testName} trial ${r.trial}: ${fmt(r.previous)}${unit} → ${fmt(r.next)}${unit}.`;
    return {
      row: r.row,
      column: r.column,
      message,
      athleteName,
      testName,
      trial: r.trial,
      previous: r.previous,
      previousFlag: r.previousFlag,
      next: r.next,
    };
  });
}
