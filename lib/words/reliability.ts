/**
 * Words for the Reliability check's codes: the Koo & Li (2016) reading of an ICC. Kept apart
 * from the numbers so the wording can change without touching a checked value.
 */
import type { KooLiBand } from "@/lib/reports/reliability-bands";

/** Koo & Li (2016, J Chiropr Med 15:155–163) reliability bands. */
export const KOO_LI_LABELS: Record<KooLiBand, string> = {
  poor: "Poor",
  moderate: "Moderate",
  good: "Good",
  excellent: "Excellent",
};

/** The band's range, as the reading is explained beside it. */
export const KOO_LI_RANGES: Record<KooLiBand, string> = {
  poor: "below 0.50",
  moderate: "0.50 to 0.75",
  good: "0.75 to 0.90",
  excellent: "0.90 or more",
};

/**
 * One sentence on the ICC(3,1) reading, and a reminder that the interval, not the point, is
 * what Koo & Li ask to be read.
 *
 * @example
 * explainIcc("good", "moderate", "excellent");
 * // => "ICC(3,1) reads as good reliability (0.75 to 0.90) on the Koo & Li (2016) scale; its interval
 * //     spans moderate to excellent, so a larger study would pin it down."
 */
export function explainIcc(point: KooLiBand, lower: KooLiBand | null, upper: KooLiBand | null): string {
  const head = `ICC(3,1) reads as ${KOO_LI_LABELS[point].toLowerCase()} reliability (${KOO_LI_RANGES[point]}) on the Koo & Li (2016) scale`;
  if (lower === null || upper === null) return `${head}.`;
  if (lower === upper) return `${head}; its whole interval lies in the same band.`;
  return `${head}; its interval spans ${KOO_LI_LABELS[lower].toLowerCase()} to ${KOO_LI_LABELS[upper].toLowerCase()}, so a larger study would pin it down.`;
}
