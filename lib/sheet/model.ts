/** Small pure helpers shared by the Session sheet hook and its cells. */

import type { ResultRow, SheetData, SheetTest } from "@/lib/client/queries";
import type { ResultFlag } from "@/lib/domain";
import { FLAG_LABELS, formatValue } from "@/lib/labels";
import { trimTrials } from "@/lib/trials";

export type Trials = (number | null)[];
/** What the person at the sheet wants a result to hold. */
export type Wanted = { trials: Trials; flag: ResultFlag | null };

export const cellKey = (athleteId: number, testId: number) => `${athleteId}:${testId}`;
export const trialKey = (athleteId: number, testId: number, index: number) => `${athleteId}:${testId}:${index}`;

/** Trials padded to the test's number of slots (older results may hold more; those are kept). */
export function padTrials(trials: Trials, slots: number): Trials {
  const out = trials.slice();
  while (out.length < slots) out.push(null);
  return out;
}

export function sameWanted(a: Wanted, b: Wanted): boolean {
  const ta = trimTrials(a.trials);
  const tb = trimTrials(b.trials);
  return a.flag === b.flag && ta.length === tb.length && ta.every((v, i) => v === tb[i]);
}

export function wantedOf(row: ResultRow | undefined): Wanted {
  return { trials: row?.trials ?? [], flag: row?.flag ?? null };
}

/** Replaces (or removes, with null) one result in the cached sheet. */
export function withRow(data: SheetData, athleteId: number, testId: number, row: ResultRow | null): SheetData {
  const rest = data.results.filter((r) => !(r.athleteId === athleteId && r.testId === testId));
  return { ...data, results: row ? [...rest, row] : rest };
}

export function plausibleWords(test: SheetTest): string {
  const { plausibleMin: min, plausibleMax: max, unit } = test;
  if (min !== null && max !== null) return `${min}–${max} ${unit}`;
  if (min !== null) return `at least ${min} ${unit}`;
  return `at most ${max} ${unit}`;
}

/**
 * "35.1, 34.8, –" plus the flag, for the Recent changes panel and conflict messages; with the
 * test's decimals, scores read as the sheet shows them ("1.80", not "1.8").
 */
export function describeEntry(
  entry: { trials: Trials; flag: ResultFlag | null } | null | undefined,
  decimals: number | null = null,
): string {
  if (!entry) return "empty";
  const trials = trimTrials(entry.trials);
  const score = (v: number) => (decimals === null ? String(v) : formatValue(v, decimals));
  const parts = trials.length > 0 ? trials.map((v) => (v === null ? "–" : score(v))).join(", ") : "";
  const flag = entry.flag ? FLAG_LABELS[entry.flag] : "";
  return [parts, flag].filter(Boolean).join(" · ") || "empty";
}

export function timeWords(ms: number): string {
  const at = new Date(ms);
  const today = new Date();
  const time = at.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" });
  return at.toDateString() === today.toDateString()
    ? time
    : `${at.toLocaleDateString("en-GB", { day: "numeric", month: "short" })} ${time}`;
}
