/**
 * The mapping step's "Use …": a name in the file that the person importing has said is a
 * roster athlete or a battery test. For this import it reads as another name of that athlete
 * or test; remembered, it becomes one (lib/aliases.ts) for the next import.
 */
import { aliasKey } from "@/lib/aliases";
import type { ImportContext, ImportMatches } from "./types";

export const NO_MATCHES: ImportMatches = { athletes: {}, tests: {} };

const quote = (s: string) => `“${s}”`;

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
      athletes: context.athletes.map((a) => ({ ...a, aliases: [...a.aliases, ...(athleteNames.get(a.id) ?? [])] })),
      tests: context.tests.map((t) => ({ ...t, aliases: [...t.aliases, ...(testNames.get(t.id) ?? [])] })),
    },
  };
}
