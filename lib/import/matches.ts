/**
 * The mapping step's "Use …": a name in the file that the person importing has said is a
 * roster athlete or a battery test. For this import it reads as another name of that athlete
 * or test; remembered, it becomes one (lib/aliases.ts) for the next import.
 */
import { aliasKey } from "@/lib/aliases";
import { parseTrialHeader } from "./columns";
import type { CsvTable } from "./csv";
import type { ImportContext, ImportMapping, ImportMatches } from "./types";

export const NO_MATCHES: ImportMatches = { athletes: {}, tests: {} };

const quote = (s: string) => `“${s}”`;

/** Whether any name is matched or left out. */
export const hasMatches = (matches: ImportMatches) =>
  Object.keys(matches.athletes).length +
    Object.keys(matches.tests).length +
    (matches.leaveOut?.athletes.length ?? 0) +
    (matches.leaveOut?.tests.length ?? 0) >
  0;

/**
 * The context with each match added to its athlete's or test's other names; a match to an
 * athlete who is not on the roster, or a test not in the battery, is a problem (sentences).
 * @example applyMatches(context, { athletes: { "Luca Dempsy": 12 }, tests: {} }).problems // []
 */
export function applyMatches(
  context: ImportContext,
  matches: ImportMatches,
): { context: ImportContext; problems: string[] } {
  const problems: string[] = [];
  const extra = (kind: "athletes" | "tests", known: Set<number>, what: string) => {
    const byId = new Map<number, string[]>();
    for (const [value, id] of Object.entries(matches[kind])) {
      if (aliasKey(value) === "") continue;
      if (!known.has(id)) {
        problems.push(`${quote(value)} is matched to ${what}.`);
        continue;
      }
      byId.set(id, [...(byId.get(id) ?? []), value.trim()]);
    }
    return byId;
  };
  const athleteNames = extra(
    "athletes",
    new Set(context.athletes.map((a) => a.id)),
    `an athlete who is not on the ${context.squadName} roster`,
  );
  const testNames = extra("tests", new Set(context.tests.map((t) => t.id)), "a test that is not in this battery");
  return {
    problems,
    context: {
      ...context,
      leaveOut: {
        athletes: new Set((matches.leaveOut?.athletes ?? []).map(aliasKey)),
        tests: new Set((matches.leaveOut?.tests ?? []).map(aliasKey)),
      },
      athletes: context.athletes.map((a) => ({ ...a, aliases: [...a.aliases, ...(athleteNames.get(a.id) ?? [])] })),
      tests: context.tests.map((t) => ({ ...t, aliases: [...t.aliases, ...(testNames.get(t.id) ?? [])] })),
    },
  };
}

/** The athlete and test names a file holds (keys as aliasKey makes them), read with its mapping. */
export function namesInFile(table: CsvTable, mapping: ImportMapping): { athletes: Set<string>; tests: Set<string> } {
  const athletes = new Set<string>();
  const tests = new Set<string>();
  const column = (name: string | null) => (name === null ? -1 : table.headers.indexOf(name));
  const athleteAt = column(mapping.format === "long" ? mapping.columns.athlete : mapping.athleteColumn);
  const testAt = mapping.format === "long" ? column(mapping.columns.test) : -1;
  for (const cells of table.rows) {
    if (athleteAt >= 0) athletes.add(aliasKey(cells[athleteAt] ?? ""));
    if (testAt >= 0) tests.add(aliasKey(cells[testAt] ?? ""));
  }
  if (mapping.format === "wide")
    for (const header of table.headers) {
      tests.add(aliasKey(header));
      tests.add(aliasKey(parseTrialHeader(header)?.name ?? header));
    }
  return { athletes, tests };
}

/**
 * The matches a file used, and the names it does not hold (a match sent for a name the file
 * never mentions is no reason to remember that name).
 */
export function usedMatches(matches: ImportMatches, present: ReturnType<typeof namesInFile>) {
  const used: ImportMatches = { athletes: {}, tests: {} };
  const absent: { kind: "athlete" | "test"; value: string }[] = [];
  for (const kind of ["athletes", "tests"] as const)
    for (const [value, id] of Object.entries(matches[kind])) {
      if (present[kind].has(aliasKey(value))) used[kind][value] = id;
      else absent.push({ kind: kind === "athletes" ? "athlete" : "test", value });
    }
  return { used, absent };
}
