/**
 * An athlete's data-rights export as CSV: the profile as "field, value" rows, a blank row, then
 * one row per result. Every cell goes through toCsv, so no text can run as a spreadsheet formula.
 */
import { type CsvCell, toCsv } from "@/lib/csv";

type ExportShape = {
  exportedAt: string;
  organization: string;
  profile: Record<string, string | boolean | null | string[]>;
  results: {
    date: string;
    phase: string;
    sessionStatus: string;
    squad: string;
    test: string;
    unit: string;
    direction: string;
    trials: (number | null)[];
    value: number | null;
    flag: string | null;
    note: string | null;
    updatedAt: string;
  }[];
};

const cell = (v: string | boolean | null | string[]): CsvCell =>
  Array.isArray(v) ? v.join("; ") : typeof v === "boolean" ? (v ? "yes" : "no") : v;

export function myExportCsv(data: ExportShape): string {
  const maxTrials = Math.max(1, ...data.results.map((r) => r.trials.length));
  const trialHeads = Array.from({ length: maxTrials }, (_, i) => `trial ${i + 1}`);
  const rows: CsvCell[][] = [
    ["field", "value"],
    ["organization", data.organization],
    ["exported at", data.exportedAt],
    ...Object.entries(data.profile).map(([k, v]): CsvCell[] => [k, cell(v)]),
    [],
    [
      "date",
      "phase",
      "session status",
      "squad",
      "test",
      "unit",
      "direction",
      "value",
      "flag",
      ...trialHeads,
      "note",
      "last changed",
    ],
    ...data.results.map((r): CsvCell[] => [
      r.date,
      r.phase,
      r.sessionStatus,
      r.squad,
      r.test,
      r.unit,
      `${r.direction} is better`,
      r.value,
      r.flag,
      ...trialHeads.map((_, i) => r.trials[i] ?? null),
      r.note,
      r.updatedAt,
    ]),
  ];
  return toCsv(rows);
}
