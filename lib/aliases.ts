/**
 * Other names for a test or an athlete ("CMJ" for the countermovement jump, "Luca Dempsy" for
 * Luca Dempsey) that the Import reads as the real one. One rule for what makes two names the
 * same (the Import's: case and runs of spaces ignored), and for when an alias may be kept.
 */
import { normaliseName } from "@/lib/import/columns";

/** The key two names share when the Import reads them as one: "  cmj " and "CMJ" → "cmj". */
export const aliasKey = normaliseName;

/**
 * The aliases as stored: trimmed, blanks, repeats and the owner's own name dropped, in the
 * order given.
 * @example cleanAliases([" CMJ", "cmj", "", "Countermovement jump"], "Countermovement jump") // ["CMJ"]
 */
export function cleanAliases(aliases: readonly string[], ownName: string): string[] {
  const seen = new Set([aliasKey(ownName)]);
  const kept: string[] = [];
  for (const alias of aliases) {
    const text = alias.trim().replace(/\s+/g, " ");
    const key = aliasKey(text);
    if (key === "" || seen.has(key)) continue;
    seen.add(key);
    kept.push(text);
  }
  return kept;
}

export type Named = { id: number; name: string; aliases: readonly string[] };

/**
 * The first of `names` that already belongs to another of `others` (as its name or one of its
 * aliases), with that owner; null when all are free. A file must never be able to read one
 * name as two different things.
 * @example aliasClash(["CMJ"], 1, [{ id: 2, name: "Squat jump", aliases: ["cmj"] }]) // { name: "CMJ", owner: "Squat jump" }
 */
export function aliasClash(
  names: readonly string[],
  ownId: number | null,
  others: readonly Named[],
): { name: string; owner: string } | null {
  const owners = new Map<string, string>();
  for (const other of others) {
    if (other.id === ownId) continue;
    for (const n of [other.name, ...other.aliases]) owners.set(aliasKey(n), other.name);
  }
  for (const name of names) {
    const owner = owners.get(aliasKey(name));
    if (owner !== undefined) return { name, owner };
  }
  return null;
}
