/**
 * Reads every data row against the mapping, the roster and the battery. Nothing is invented:
 * an athlete or test that cannot be matched is an error on its row, and is listed.
 */

import { MAX_TRIALS } from "@/lib/domain";
import type { RowError } from "@/lib/errors";
import { normaliseName, testNameIndex } from "./columns";
import { runToEnd, type Steps } from "./cooperative";
import type { CsvTable } from "./csv";
import { MAX_LISTED_ERRORS, MAX_SHOWN_CHARS, PREVIEW_ROWS } from "./limits";
import { trialLimit } from "./mapping";
import { parseScore } from "./numbers";
import { suggestionsFor } from "./suggest";
import type {
  ColumnOf,
  ImportAthlete,
  ImportContext,
  ImportFormat,
  ImportGroup,
  ImportMapping,
  ImportTest,
  LeftOut,
  UnknownAthlete,
  UnknownTest,
} from "./types";

export type PreviewValue = {
  row: number;
  column: string;
  athleteName: string;
  testName: string;
  trial: number;
  value: number;
};

export type ImportPlan = {
  format: ImportFormat;
  groups: ImportGroup[];
  /** Where each test × trial was read from, for messages about a value. */
  columnOf: ColumnOf;
  valueCount: number;
  /** Data rows that gave at least one value. */
  rowsWithValues: number;
  /** Non-blank data rows. */
  rowCount: number;
  errors: RowError[];
  errorCount: number;
  /** Values outside a test's plausible range: shown, never blocking. */
  warnings: RowError[];
  warningCount: number;
  /** The first MAX_LISTED_ERRORS of them; `unknownAthleteCount` says how many there are. */
  unknownAthletes: UnknownAthlete[];
  unknownAthleteCount: number;
  unknownTests: UnknownTest[];
  /** Rows left out as asked, by name. */
  leftOut: LeftOut[];
  sample: PreviewValue[];
};

/** Keeps the first errors in full and counts the rest. */
class Listing {
  readonly items: RowError[] = [];
  count = 0;
  add(error: RowError) {
    this.count++;
    if (this.items.length < MAX_LISTED_ERRORS) this.items.push(error);
  }
}

type AthleteMatch = { athlete: ImportAthlete } | { problem: "unknown" | "ambiguous" | "missing" };

/** Keys to athletes; a key two athletes share maps to null (ambiguous). */
function uniqueIndex(athletes: ImportAthlete[], keysOf: (a: ImportAthlete) => string[]) {
  const index = new Map<string, ImportAthlete | null>();
  for (const a of athletes) {
    for (const key of new Set(keysOf(a).map(normaliseName))) index.set(key, index.has(key) ? null : a);
  }
  return index;
}

/**
 * External id first, then exact (case-insensitive, trimmed) name, then another name of the
 * athlete (remembered, or matched in this import: that one also settles a name two athletes
 * share); each distinct cell resolved once.
 */
function athleteMatcher(athletes: ImportAthlete[]) {
  const byExternal = new Map<string, ImportAthlete>();
  for (const a of athletes) if (a.externalId) byExternal.set(normaliseName(a.externalId), a);
  const byName = uniqueIndex(athletes, (a) => [a.name]);
  const byAlias = uniqueIndex(athletes, (a) => a.aliases);
  const cache = new Map<string, AthleteMatch>();
  return (cell: string): AthleteMatch => {
    let match = cache.get(cell);
    if (match) return match;
    const key = normaliseName(cell);
    if (key === "") return { problem: "missing" };
    const found = byExternal.get(key) ?? byName.get(key) ?? byAlias.get(key);
    if (found) match = { athlete: found };
    else match = { problem: byName.get(key) === null || byAlias.get(key) === null ? "ambiguous" : "unknown" };
    cache.set(cell, match);
    return match;
  };
}

class Tally<T extends { count: number; rows: number[] }> {
  readonly byKey = new Map<string, T>();
  add(key: string, row: number, make: () => T) {
    let entry = this.byKey.get(key);
    if (!entry) {
      entry = make();
      this.byKey.set(key, entry);
    }
    entry.count++;
    if (entry.rows.length < 10) entry.rows.push(row);
  }
  list() {
    return [...this.byKey.values()];
  }
}

const quote = (s: string) => `“${s}”`;
const shown = (s: string) => quote(s.length > 60 ? `${s.slice(0, 60)}…` : s);
/** Cell text echoed back in a listing: enough to recognise it, never the whole of a huge cell. */
const clip = (s: string) => (s.length > MAX_SHOWN_CHARS ? `${s.slice(0, MAX_SHOWN_CHARS)}…` : s);

/** Cells read between two chances to pause (see cooperative.ts). */
const STEP_CELLS = 4096;

export const buildPlan = (table: CsvTable, mapping: ImportMapping, context: ImportContext): ImportPlan =>
  runToEnd(planSteps(table, mapping, context));

export function* planSteps(table: CsvTable, mapping: ImportMapping, context: ImportContext): Steps<ImportPlan> {
  const { headers, rows, rowNumbers, delimiter } = table;
  const errors = new Listing();
  const warnings = new Listing();
  for (const problem of table.problems) errors.add(problem);
  errors.count += table.problemCount - table.problems.length;
  let work = 0;
  const unknownAthletes = new Tally<UnknownAthlete>();
  const unknownTests = new Tally<UnknownTest>();
  const matchAthlete = athleteMatcher(context.athletes);
  // Numeric keys (athlete id × battery position): no string built per row of a 100 000-row file.
  const groups = new Map<number, ImportGroup>();
  const position = new Map(context.tests.map((t, i) => [t.id, i]));
  const width = context.tests.length + 1;
  let rowsWithValues = 0;
  let lastPlacedRow = -1;
  const sample: PreviewValue[] = [];
  let valueCount = 0;
  const roster = `the ${context.squadName} roster`;
  const leftOut = new Map<string, LeftOut>();
  /** True when the row's athlete or test is one the person importing asked to leave out. */
  // Read once: most imports leave nothing out, and then no row pays for the check.
  const kinds = context.leaveOut?.athletes.size || context.leaveOut?.tests.size ? context.leaveOut : undefined;
  const leaveOut = (athleteCell: string, testCell: string | null): boolean => {
    if (!kinds) return false;
    const athlete = normaliseName(athleteCell);
    const test = testCell === null ? "" : normaliseName(testCell);
    const kind = kinds.athletes.has(athlete) ? "athlete" : test !== "" && kinds.tests.has(test) ? "test" : null;
    if (kind === null) return false;
    const name = kind === "athlete" ? athleteCell.trim() : (testCell ?? "").trim();
    const key = `${kind}:${kind === "athlete" ? athlete : test}`;
    const entry = leftOut.get(key) ?? { kind, name: clip(name), rows: 0 };
    entry.rows++;
    leftOut.set(key, entry);
    return true;
  };

  const athleteFor = (cell: string, row: number, column: string): ImportAthlete | null => {
    const match = matchAthlete(cell);
    if ("athlete" in match) return match.athlete;
    if (match.problem === "missing") {
      errors.add({ row, column, message: "The athlete is missing." });
      return null;
    }
    const text = cell.trim();
    unknownAthletes.add(normaliseName(text), row, () => ({
      value: clip(text),
      reason: match.problem as UnknownAthlete["reason"],
      count: 0,
      rows: [],
    }));
    errors.add({
      row,
      column,
      message:
        match.problem === "ambiguous"
          ? `Two athletes on ${roster} are called ${shown(text)}. Use their external id instead.`
          : `No athlete ${shown(text)} on ${roster} (matched by external id, then by name). Match the name above (Names in the file), add them to the Roster, or correct the file.`,
    });
    return null;
  };

  const place = (
    athlete: ImportAthlete,
    test: ImportTest,
    trial: number,
    value: number,
    row: number,
    column: string,
  ) => {
    const key = athlete.id * width + position.get(test.id)!;
    let group = groups.get(key);
    if (!group) {
      group = { athleteId: athlete.id, testId: test.id, values: [], rows: [] };
      groups.set(key, group);
    }
    const k = trial - 1;
    if (k < group.values.length && group.values[k] !== null) {
      errors.add({
        row,
        column,
        message: `Rows ${group.rows[k]} and ${row} both give ${test.name} trial ${trial} for ${athlete.name}. Keep one of them.`,
      });
      return;
    }
    while (group.values.length < k) {
      group.values.push(null);
      group.rows.push(0);
    }
    group.values[k] = value;
    group.rows[k] = row;
    valueCount++;
    if (row !== lastPlacedRow) {
      rowsWithValues++;
      lastPlacedRow = row;
    }
    if (
      (test.plausibleMin !== null && value < test.plausibleMin) ||
      (test.plausibleMax !== null && value > test.plausibleMax)
    ) {
      warnings.add({
        row,
        column,
        message: `${value} ${test.unit} is outside the plausible range for ${test.name} (${test.plausibleMin ?? "–"} to ${test.plausibleMax ?? "–"} ${test.unit}). Check the unit and the decimal mark.`,
      });
    }
    if (sample.length < PREVIEW_ROWS)
      sample.push({ row, column, athleteName: athlete.name, testName: test.name, trial, value });
  };

  const checkWidth = (cells: string[], row: number) => {
    for (let c = headers.length; c < cells.length; c++) {
      if (cells[c].trim() !== "") {
        errors.add({
          row,
          message: `This row has ${cells.length} cells but the header has ${headers.length} columns. Check for a stray delimiter (a decimal comma in a comma-separated file?).`,
        });
        return false;
      }
    }
    return true;
  };

  let columnOf: ColumnOf = () => "";
  if (mapping.format === "long") {
    const col = (name: string | null) => (name === null ? -1 : headers.indexOf(name));
    const ai = col(mapping.columns.athlete);
    const ti = col(mapping.columns.test);
    const ri = col(mapping.columns.trial);
    const vi = col(mapping.columns.value);
    const readable = ai >= 0 && ti >= 0 && vi >= 0;
    const byName = testNameIndex(context.tests);
    const otherNames = new Set(context.otherTestNames.map(normaliseName));
    // Caches keyed by the raw cell: a file repeats the same few names and numbers many times.
    const testCache = new Map<string, ImportTest | "unknown" | "not-in-battery" | "missing">();
    const trialCache = new Map<string, number>();
    const [aName, tName, rName, vName] = [
      mapping.columns.athlete!,
      mapping.columns.test!,
      mapping.columns.trial ?? "",
      mapping.columns.value!,
    ];
    const valueColumn = ri >= 0 ? rName : vName;
    columnOf = () => valueColumn;

    for (let i = 0; readable && i < rows.length; i++) {
      work += 4;
      if (work >= STEP_CELLS) {
        work = 0;
        yield;
      }
      const cells = rows[i];
      const row = rowNumbers[i];
      if (cells.length > headers.length && !checkWidth(cells, row)) continue;
      if (vi >= cells.length) {
        // A short row would otherwise read as an empty score and vanish without a word.
        errors.add({
          row,
          message: `This row has ${cells.length} ${cells.length === 1 ? "cell" : "cells"} but the header has ${headers.length} columns, so it has no score. Check the delimiter of this row.`,
        });
        continue;
      }
      if (leaveOut(cells[ai] ?? "", cells[ti] ?? "")) continue;
      const score = parseScore(cells[vi], delimiter);
      if (score === null) continue;
      let failed = false;
      if (typeof score === "string") {
        errors.add({ row, column: vName, message: score });
        failed = true;
      }
      const athlete = athleteFor(cells[ai] ?? "", row, aName);
      if (!athlete) failed = true;

      const rawTest = cells[ti] ?? "";
      let test: ImportTest | null = null;
      let found = testCache.get(rawTest);
      if (found === undefined) {
        const key = normaliseName(rawTest);
        found = key === "" ? "missing" : (byName.get(key) ?? (otherNames.has(key) ? "not-in-battery" : "unknown"));
        testCache.set(rawTest, found);
      }
      if (found === "missing") {
        errors.add({ row, column: tName, message: "The test is missing." });
        failed = true;
      } else {
        const testCell = rawTest.trim();
        if (typeof found === "string") {
          unknownTests.add(normaliseName(testCell), row, () => ({
            name: clip(testCell),
            reason: found as UnknownTest["reason"],
            count: 0,
            rows: [],
          }));
          errors.add({
            row,
            column: tName,
            message:
              found === "unknown"
                ? `No test in the Test library is called ${shown(testCell)}. Match it above (Names in the file), or give the test this other name in the Test library.`
                : `${shown(testCell)} is not in this session's battery. Add it to the battery first, or leave these rows out.`,
          });
          failed = true;
        } else test = found;
      }

      let trial = 1;
      if (ri >= 0) {
        const rawTrial = cells[ri] ?? "";
        let parsedTrial = trialCache.get(rawTrial);
        if (parsedTrial === undefined) {
          const text = rawTrial.trim();
          parsedTrial = /^\d{1,3}$/.test(text) ? Number(text) : -1;
          trialCache.set(rawTrial, parsedTrial);
        }
        const trialCell = rawTrial.trim();
        const limit = test ? trialLimit(test.trialsPerSession) : MAX_TRIALS;
        if (parsedTrial < 0) {
          errors.add({
            row,
            column: rName,
            message:
              trialCell === ""
                ? "The trial number is missing."
                : `${shown(trialCell)} is not a trial number (1, 2, 3…).`,
          });
          failed = true;
        } else {
          trial = parsedTrial;
          if (trial < 1 || trial > limit) {
            errors.add({
              row,
              column: rName,
              message: test
                ? `${test.name} takes trials 1 to ${limit} in a session; this row gives trial ${trial}.`
                : `Trial ${trial} is out of range.`,
            });
            failed = true;
          }
        }
      }
      if (failed || !test || !athlete || typeof score !== "number") continue;
      place(athlete, test, trial, score, row, valueColumn);
    }
  } else {
    const ai = mapping.athleteColumn === null ? -1 : headers.indexOf(mapping.athleteColumn);
    const testsById = new Map(context.tests.map((t) => [t.id, t]));
    const targets: { index: number; header: string; test: ImportTest; trial: number }[] = [];
    const unnamed: number[] = [];
    const headerOf = new Map<string, string>();
    columnOf = (testId, trial) => headerOf.get(`${testId}:${trial}`) ?? "";
    headers.forEach((header, index) => {
      if (index === ai) return;
      const target = mapping.columns[header];
      if (target) {
        const test = testsById.get(target.testId);
        if (test) {
          targets.push({ index, header, test, trial: target.trial });
          headerOf.set(`${test.id}:${target.trial}`, header);
        }
      } else if (header === "") unnamed.push(index);
    });

    for (let i = 0; ai >= 0 && targets.length > 0 && i < rows.length; i++) {
      work += targets.length + unnamed.length;
      if (work >= STEP_CELLS) {
        work = 0;
        yield;
      }
      const cells = rows[i];
      const row = rowNumbers[i];
      if (cells.length > headers.length && !checkWidth(cells, row)) continue;
      for (const index of unnamed) {
        if ((cells[index] ?? "").trim() !== "") {
          errors.add({
            row,
            column: `column ${index + 1}`,
            message: `Column ${index + 1} has no header, so its values cannot be placed. Head it with a test name, or remove it.`,
          });
          break;
        }
      }
      if (leaveOut(cells[ai] ?? "", null)) continue;
      const scores = targets.map((t) => parseScore(cells[t.index] ?? "", delimiter));
      if (scores.every((s) => s === null)) continue;
      const athlete = athleteFor(cells[ai] ?? "", row, mapping.athleteColumn!);
      scores.forEach((score, k) => {
        const target = targets[k];
        if (typeof score === "string") errors.add({ row, column: target.header, message: score });
        else if (score !== null && athlete) place(athlete, target.test, target.trial, score, row, target.header);
      });
    }
  }

  const rowsOut = [...errors.items].sort((a, b) => a.row - b.row);
  return {
    format: mapping.format,
    groups: [...groups.values()],
    columnOf,
    valueCount,
    rowsWithValues,
    rowCount: rows.length,
    errors: rowsOut,
    errorCount: errors.count,
    warnings: warnings.items,
    warningCount: warnings.count,
    // Suggestions for the listed ones only: a bounded list against a squad's roster and battery.
    unknownAthletes: unknownAthletes
      .list()
      .slice(0, MAX_LISTED_ERRORS)
      .map((a) =>
        a.reason === "unknown"
          ? {
              ...a,
              suggestions: suggestionsFor(a.value, context.athletes),
            }
          : a,
      ),
    unknownAthleteCount: unknownAthletes.byKey.size,
    leftOut: [...leftOut.values()],
    unknownTests: unknownTests
      .list()
      .slice(0, MAX_LISTED_ERRORS)
      .map((t) =>
        t.reason === "unknown"
          ? {
              ...t,
              suggestions: suggestionsFor(t.name, context.tests),
            }
          : t,
      ),
    sample,
  };
}
