/**
 * "Did you mean …?" for names the Import does not know: the same name with other accents or
 * case, initials for a first name ("L. Dempsey"), first and last name swapped, a short form
 * ("CMJ"), or a spelling a key or two away ("Luca Dempsy"). Suggestions only; nothing is matched without the person.
 */

/** Lower case, accents and punctuation gone, single spaces: "Clío  O'Neil" → "clio o neil". */
export function foldName(value: string): string {
  return value
    .normalize("NFD")
    .replace(/\p{M}/gu, "")
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, " ")
    .trim();
}

/**
 * Levenshtein distance (insertions, deletions, substitutions), one row of memory.
 * @example editDistance("dempsy", "dempsey") // 1
 */
export function editDistance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++)
      current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    previous = current;
  }
  return previous[b.length];
}

/**
 * "cmj" for "countermovement jump": one short word of letters, starting with the candidate's
 * first letter, ending with its last word's first letter, the rest in order in between.
 */
function isAbbreviation(value: string, words: string[]): boolean {
  if (!/^[a-z]{2,5}$/.test(value) || words.length < 2) return false;
  const letters = words.join("");
  if (value[0] !== letters[0] || value[value.length - 1] !== words[words.length - 1][0]) return false;
  let at = 1;
  const lastWordStart = letters.length - words[words.length - 1].length;
  for (const ch of value.slice(1, -1)) {
    at = letters.indexOf(ch, at);
    if (at < 0 || at >= lastWordStart) return false;
    at++;
  }
  return true;
}

/** How close a folded value is to a folded candidate: lower is closer, null is not close. */
function closeness(value: string, candidate: string): number | null {
  if (value === candidate) return 0;
  const v = value.split(" ");
  const c = candidate.split(" ");
  const swapped = v.length === 2 && c.length === 2 && v[0] === c[1] && v[1] === c[0];
  // "l dempsey" for "luca dempsey": an initial for every name but the last.
  const initials =
    v.length === c.length && v.length > 1 && v.every((t, i) => (i === v.length - 1 ? t === c[i] : c[i].startsWith(t)));
  if (swapped || initials) return 0.5;
  if (v.length === 1 && isAbbreviation(value, c)) return 1.5;
  // Numbers name different things: a 10 m sprint is never a 30 m sprint mistyped.
  const digits = (text: string) => text.replace(/\D+/g, " ").trim();
  if (digits(value) !== digits(candidate)) return null;
  // A slip of a key or two: at most one edit in five characters — in the candidate's word order, or
  // with the words sorted ("Sprnt 10 m" for "10 m sprint"), which counts half an edit more.
  const limit = Math.max(1, Math.floor(candidate.length / 5));
  const distance = editDistance(value, candidate);
  if (distance <= limit) return distance;
  const sorted = (words: string[]) => [...words].sort().join(" ");
  const reordered = editDistance(sorted(v), sorted(c)) + 0.5;
  return reordered <= limit ? reordered : null;
}

/**
 * Up to `max` candidates whose name is close to `value`, closest first.
 * @example suggestMatches("Luca Dempsy", [{ id: 4, name: "Luca Dempsey" }]) // [{ id: 4, name: "Luca Dempsey" }]
 */
export function suggestMatches<T extends { name: string }>(value: string, candidates: readonly T[], max = 3): T[] {
  const folded = foldName(value).slice(0, 120);
  if (folded === "") return [];
  return candidates
    .map((candidate) => ({ candidate, score: closeness(folded, foldName(candidate.name).slice(0, 120)) }))
    .filter((c): c is { candidate: T; score: number } => c.score !== null)
    .sort((a, b) => a.score - b.score || a.candidate.name.localeCompare(b.candidate.name))
    .slice(0, max)
    .map((c) => c.candidate);
}

/**
 * The names of up to `max` candidates close to `value`, closest first.
 * @example suggestNames("Luca Dempsy", ["Luca Dempsey", "Theo Varga"]) // ["Luca Dempsey"]
 */
export const suggestNames = (value: string, candidates: readonly string[], max = 3): string[] =>
  suggestMatches(
    value,
    candidates.map((name) => ({ name })),
    max,
  ).map((c) => c.name);

/** What the mapping step offers for a name it does not know: id and name, for a "Use …" button. */
export type Suggestion = { id: number; name: string };

export const suggestionsFor = (value: string, candidates: readonly Suggestion[]): Suggestion[] =>
  suggestMatches(value, candidates).map(({ id, name }) => ({ id, name }));
