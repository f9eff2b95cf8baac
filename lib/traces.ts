/**
 * Finding and removing a person's traces inside stored values (audit before/after, report
 * snapshots, study summaries, free text), for the real deletion of an athlete. Pure functions.
 */

/** What identifies the athlete: their record id, their account's id, and words (name, external id, e-mail). */
export type Traces = { athleteId: number; userId: number | null; words: string[] };

export const REMOVED_NAME = "[deleted athlete]";

const ATHLETE_ID_KEY = /^athleteId$/i;
const ATHLETE_IDS_KEY = /^athleteIds$/i;
const USER_ID_KEY = /^(userId|user_id)$/;

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** One pattern for all the words, case-insensitive; an external id must stand alone ("A01" is not in "A012"). */
function wordPattern(words: string[]): RegExp | null {
  const usable = [...new Set(words.map((w) => w.trim()).filter((w) => w.length >= 2))];
  if (usable.length === 0) return null;
  // Longest first, so a full name is replaced before any shorter word inside it.
  usable.sort((a, b) => b.length - a.length);
  return new RegExp(`(?<![\\p{L}\\p{N}])(?:${usable.map(escapeRegExp).join("|")})(?![\\p{L}\\p{N}])`, "giu");
}

export function textMentions(text: string, traces: Traces): boolean {
  const pattern = wordPattern(traces.words);
  return pattern ? pattern.test(text) : false;
}

/** The text with every word of the athlete replaced. */
export function scrubText(text: string, traces: Traces): string {
  const pattern = wordPattern(traces.words);
  return pattern ? text.replace(pattern, REMOVED_NAME) : text;
}

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === "object" && value !== null && !Array.isArray(value);

/** True when a stored value names the athlete: an athlete or user id under its key, or one of the words. */
export function mentions(value: unknown, traces: Traces): boolean {
  if (typeof value === "string") return textMentions(value, traces);
  if (Array.isArray(value)) return value.some((item) => mentions(item, traces));
  if (!isRecord(value)) return false;
  return Object.entries(value).some(([key, v]) => {
    if (ATHLETE_ID_KEY.test(key) && v === traces.athleteId) return true;
    if (ATHLETE_IDS_KEY.test(key) && Array.isArray(v) && v.includes(traces.athleteId)) return true;
    if (USER_ID_KEY.test(key) && traces.userId !== null && v === traces.userId) return true;
    return mentions(v, traces);
  });
}

/**
 * The value without the athlete: list entries about them go (a row of a report's athlete table),
 * ids under their keys are cleared, and their words in any text are replaced.
 */
export function scrub(value: unknown, traces: Traces): unknown {
  if (typeof value === "string") return scrubText(value, traces);
  if (Array.isArray(value))
    return value.filter((item) => !(isRecord(item) && mentions(item, traces))).map((item) => scrub(item, traces));
  if (!isRecord(value)) return value;
  return Object.fromEntries(
    Object.entries(value).map(([key, v]) => {
      if (ATHLETE_ID_KEY.test(key) && v === traces.athleteId) return [key, null];
      if (ATHLETE_IDS_KEY.test(key) && Array.isArray(v)) return [key, v.filter((id) => id !== traces.athleteId)];
      if (USER_ID_KEY.test(key) && traces.userId !== null && v === traces.userId) return [key, null];
      return [key, scrub(v, traces)];
    }),
  );
}

/** Whether raw file bytes (an uploaded CSV) name the athlete, in the encodings a spreadsheet writes. */
export function bytesMention(bytes: Uint8Array, traces: Traces): boolean {
  const texts = [new TextDecoder("utf-8").decode(bytes), new TextDecoder("utf-16le").decode(bytes)];
  try {
    texts.push(new TextDecoder("windows-1252").decode(bytes));
  } catch {
    // Every runtime we ship on has it; the other two readings still count.
  }
  return texts.some((text) => textMentions(text, traces));
}
