/**
 * Magnitude words for a standardized change on the scale of Hopkins, Marshall,
 * Batterham & Hanin (2009, MSSE 41:3–12): thresholds 0.2, 0.6, 1.2, 2.0 and
 * 4.0 between trivial, small, moderate, large, very large and extremely large.
 * The sign is ignored; direction is reported separately. Each threshold
 * belongs to the band above it (0.2 is "small").
 *
 * The standardizer should be the between-athlete SD (baseline SD for
 * pre/post), not the SD of the changes (METHODS.md §5).
 *
 * @example
 * magnitudeOfEffect(0.45); // "small"
 * magnitudeOfEffect(-1.3); // "large"
 */
import { assertFinite } from "./validate";

export type Magnitude = "trivial" | "small" | "moderate" | "large" | "very large" | "extremely large";

export const MAGNITUDE_THRESHOLDS = [0.2, 0.6, 1.2, 2.0, 4.0] as const;

const WORDS: readonly Magnitude[] = ["trivial", "small", "moderate", "large", "very large", "extremely large"];

export function magnitudeOfEffect(standardisedChange: number): Magnitude {
  assertFinite(standardisedChange, "The standardised change");
  const size = Math.abs(standardisedChange);
  let band = 0;
  while (band < MAGNITUDE_THRESHOLDS.length && size >= MAGNITUDE_THRESHOLDS[band]) band++;
  return WORDS[band];
}
