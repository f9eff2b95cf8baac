/**
 * My progress and the results mail in words an athlete reads: how a score moved, whether that
 * is better for this test, and what the verdict means — respecting the test's direction, so a
 * sprint time that falls reads as an improvement.
 */
import type { ConsentMissing } from "@/lib/consent";
import type { Direction, ResultFlag } from "@/lib/domain";
import { FLAG_LABELS, formatDate } from "@/lib/labels";
import type { SwcBasis } from "@/lib/reports/athlete-history";
import type { Verdict } from "@/lib/stats";
import { plain } from "./report";

/** "fell by 0.05 s", "rose by 1.2 cm", "did not change" (at the test's decimals). */
export function movementWords(change: number, decimals: number, unit: string): string {
  const size = Math.abs(change).toFixed(decimals);
  if (Number(size) === 0) return "did not change";
  return `${change < 0 ? "fell" : "rose"} by ${size} ${unit}`;
}

/** Whether a change is better for the athlete, by the test's direction; null when it rounds to nothing. */
export function betterOrWorse(change: number, decimals: number, direction: Direction): "better" | "worse" | null {
  if (Number(Math.abs(change).toFixed(decimals)) === 0) return null;
  return change > 0 === (direction === "higher") ? "better" : "worse";
}

const directionNote = (direction: Direction) => `${direction === "higher" ? "higher" : "lower"} is better here`;

/** What each verdict says to the athlete whose change it is (PRODUCT.md §5, in plain words). */
export const VERDICT_SENTENCES: Record<Verdict, string> = {
  "clear-gain": "That is more than the test's noise and more than the smallest change that matters.",
  gain: "That is more than the test's noise, but it may still be less than the smallest change that matters.",
  steady:
    "Allowing for the test's noise, any real change is smaller than the smallest change that matters: you held steady.",
  decline: "That is more than the test's noise, but the drop may still be less than the smallest change that matters.",
  "clear-decline": "That is more than the test's noise and more than the smallest change that matters.",
  inconclusive: "The test's noise is too large to tell whether this is a real change.",
};

/** The minimum count of squad scores behind an SWC from the squad's spread (see lib/data/my-progress). */
export const noVerdictWords = (basis: SwcBasis, minSquad: number): string => {
  switch (basis) {
    case "no-te":
      return "This test has no typical error recorded yet, so nobody can tell yet whether a change of this size is real or just the test's own noise. It shows which way you moved, not whether it matters.";
    case "squad":
      return `The test's noise is known, but its smallest change that matters comes from the spread of your squad's scores, and fewer than ${minSquad} of you were scored that day. To keep your team-mates' results private, no verdict is given.`;
    default:
      return "The smallest change that matters is not set for this test yet, so no verdict is given.";
  }
};

export type ChangeForWords = {
  testName: string;
  unit: string;
  decimals: number;
  direction: Direction;
  change: number;
  previousDate: string;
};

/**
 * "Your 10 m sprint result fell by 0.05 s since 7 Sep 2026 — an improvement (lower is better here)."
 */
export function changeSentence(c: ChangeForWords): string {
  const moved = movementWords(c.change, c.decimals, c.unit);
  const which = betterOrWorse(c.change, c.decimals, c.direction);
  const tail =
    which === "better"
      ? ` — an improvement (${directionNote(c.direction)})`
      : which === "worse"
        ? ` — a step back (${directionNote(c.direction)})`
        : "";
  return `Your ${c.testName} result ${moved} since ${formatDate(c.previousDate)}${tail}.`;
}

/** A score as a mail line or a table cell: "1.84 s", or the flag ("Injured: not scored"). */
export function scoreWords(value: number | null, flag: ResultFlag | null, decimals: number, unit: string): string {
  if (flag) return `${FLAG_LABELS[flag]}: not scored`;
  return value === null ? "no score" : `${plain(value, decimals)} ${unit}`;
}

/** The mail's note beside a score: "−0.05 s since 7 Sep 2026: an improvement, as lower is better here". */
export function changeNote(c: ChangeForWords): string {
  const size = Math.abs(c.change).toFixed(c.decimals);
  const since = `since ${formatDate(c.previousDate)}`;
  const which = betterOrWorse(c.change, c.decimals, c.direction);
  if (which === null) return `no change ${since}`;
  const signedSize = `${c.change < 0 ? "−" : "+"}${size} ${c.unit}`;
  return `${signedSize} ${since}: ${which === "better" ? "an improvement" : "a step back"}, as ${directionNote(c.direction)}`;
}

/** Why an athlete does not see their results, for staff in the publish dialog. */
export const CONSENT_MISSING_WORDS: Record<ConsentMissing, string> = {
  athlete: "no consent recorded",
  guardian: "under 18 on the publish date and no guardian's consent recorded",
};
