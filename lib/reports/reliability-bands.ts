/**
 * The Reliability check's small fixed scales, apart from the statistics so the screens can use
 * them without loading the distributions.
 */

/** Koo & Li (2016, J Chiropr Med 15:155–163) bands; codes only, words in lib/words/reliability.ts. */
export type KooLiBand = "poor" | "moderate" | "good" | "excellent";

/** Powers the Planner offers; 80 % is the usual planning choice. */
export const PLANNER_POWERS = [0.7, 0.8, 0.9, 0.95] as const;

/**
 * The Koo & Li band of an ICC: below 0.50 poor, 0.50 to below 0.75 moderate, 0.75 to below
 * 0.90 good, 0.90 and above excellent (the cut-offs as coded by R's effectsize::interpret_icc).
 */
export function kooLiBand(icc: number): KooLiBand {
  if (icc < 0.5) return "poor";
  if (icc < 0.75) return "moderate";
  if (icc < 0.9) return "good";
  return "excellent";
}
