/**
 * Reading the header: which format the file is in, which column names the athlete, and which
 * test and trial each wide column holds.
 */
import type { ImportContext, ImportFormat, ImportTest, LongColumns, WideColumnSuggestion } from "./types";

/** Case-insensitive, trimmed, inner runs of spaces collapsed. */
export const normaliseName = (value: string) => value.trim().replace(/\s+/g, " ").toLowerCase();

const ALIASES = {
  athlete: [
    "athlete",
    "athlete name",
    "name",
    "player",
    "player name",
    "athlete id",
    "external id",
    "externalid",
    "id",
  ],
  test: ["test", "test name", "exercise"],
  trial: ["trial", "attempt", "trial number", "rep"],
  value: ["value", "score", "result"],
};

/** Columns that often ride along in exports and are not tests: suggested as "ignore". */
const NOT_TESTS = new Set([
  "position",
  "squad",
  "team",
  "group",
  "date",
  "session",
  "notes",
  "note",
  "comment",
  "comments",
  "sex",
  "gender",
  "dob",
  "date of birth",
  "birth date",
  "number",
  "no",
  "no.",
  "#",
  "shirt",
  "email",
  "e-mail",
  ...ALIASES.athlete,
]);

function findColumn(headers: string[], aliases: string[]): string | null {
  for (const alias of aliases) {
    const found = headers.find((h) => normaliseName(h) === alias);
    if (found !== undefined) return found;
  }
  return null;
}

export const findLongColumns = (headers: string[]): LongColumns => ({
  athlete: findColumn(headers, ALIASES.athlete),
  test: findColumn(headers, ALIASES.test),
  trial: findColumn(headers, ALIASES.trial),
  value: findColumn(headers, ALIASES.value),
});

export const findAthleteColumn = (headers: string[]) => findColumn(headers, ALIASES.athlete);

/** Long when a column is headed "test" (no wide file has one); wide otherwise. */
export function detectFormat(headers: string[]): ImportFormat {
  return findColumn(headers, ALIASES.test) !== null ? "long" : "wide";
}

const TRIAL_SUFFIX =
  /^(.+?)\s*(?:\(\s*(?:trial|attempt|t)?\s*(\d{1,2})\s*\)|\[\s*(?:trial|attempt|t)?\s*(\d{1,2})\s*\]|#\s*(\d{1,2})|(?:\s|[-–—:_])\s*(?:(?:trial|attempt|t)\s*)?(\d{1,2}))$/i;

/**
 * Splits a wide header into test name and trial: "Countermovement jump 2", "… #2", "… (trial 2)",
 * "… - trial 2", "… T2", "… [2]". Null when the header carries no trial number.
 *
 * @example parseTrialHeader("10 m sprint (trial 3)") // { name: "10 m sprint", trial: 3 }
 */
export function parseTrialHeader(header: string): { name: string; trial: number } | null {
  const match = TRIAL_SUFFIX.exec(header.trim());
  if (!match) return null;
  const digits = match[2] ?? match[3] ?? match[4] ?? match[5];
  const name = match[1]
    .trim()
    .replace(/[-–—:_]$/, "")
    .trim();
  if (!name) return null;
  return { name, trial: Number(digits) };
}

/**
 * Test lookup by name, also accepting the name followed by its unit ("Countermovement jump (cm)")
 * and the test's other names ("CMJ", "CMJ (cm)").
 */
export function testNameIndex(tests: ImportTest[]): Map<string, ImportTest> {
  const index = new Map<string, ImportTest>();
  for (const test of tests) {
    const name = normaliseName(test.name);
    for (const variant of [`${name} (${test.unit})`, `${name} [${test.unit}]`]) {
      const key = normaliseName(variant);
      if (!index.has(key)) index.set(key, test);
    }
  }
  for (const test of tests) {
    for (const alias of test.aliases) {
      for (const variant of [alias, `${alias} (${test.unit})`, `${alias} [${test.unit}]`]) {
        const key = normaliseName(variant);
        if (!index.has(key)) index.set(key, test);
      }
    }
  }
  // Plain names last so they win over a variant or an alias that happens to collide.
  for (const test of tests) index.set(normaliseName(test.name), test);
  return index;
}

/** Reads one wide header against the battery (exact name first, so a test whose name ends in a number still matches). */
function matchWideHeader(
  header: string,
  byName: Map<string, ImportTest>,
  otherNames: Set<string>,
): { status: "matched"; test: ImportTest; trial: number } | { status: "unknown" | "not-in-battery"; name: string } {
  const whole = byName.get(normaliseName(header));
  if (whole) return { status: "matched", test: whole, trial: 1 };
  const split = parseTrialHeader(header);
  if (split) {
    const test = byName.get(normaliseName(split.name));
    if (test) return { status: "matched", test, trial: split.trial };
  }
  if (otherNames.has(normaliseName(header))) return { status: "not-in-battery", name: header.trim() };
  if (split && otherNames.has(normaliseName(split.name))) return { status: "not-in-battery", name: split.name };
  return { status: "unknown", name: split?.name ?? header.trim() };
}

/** The suggested reading of every column of a wide file, for the mapping step. */
export function suggestWideColumns(
  headers: string[],
  context: ImportContext,
  athleteColumn: string | null,
): WideColumnSuggestion[] {
  const byName = testNameIndex(context.tests);
  const otherNames = new Set(context.otherTestNames.map(normaliseName));
  return headers.map((header): WideColumnSuggestion => {
    if (header === athleteColumn) return { header, status: "athlete", testId: null, trial: null };
    const match = matchWideHeader(header, byName, otherNames);
    if (match.status === "matched") return { header, status: "matched", testId: match.test.id, trial: match.trial };
    if (match.status === "unknown" && (header.trim() === "" || NOT_TESTS.has(normaliseName(header)))) {
      return { header, status: "ignored", testId: null, trial: null };
    }
    return { header, status: match.status, testId: null, trial: null };
  });
}
