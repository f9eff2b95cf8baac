import { assertFinite } from "./validate";

/** Magnitude codes; words for people live in `lib/words/stats.ts`. */
export type Magnitude = "trivial" | "small" | "moderate" | "large" | "very large" | "extremely large";

/** Lower edges of small, moderate, large, very large and extremely large. */
export const MAGNITUDE_THRESHOLDS = [0.2, 0.6, 1.2, 2.0, 4.0] as const;

const BANDS: readonly Magnitude[] = ["trivial", "small", "moderate", "large", "very large", "extremely large"];

/**
 * Magnitude band of a standardized change.
 *
 * Scale of Hopkins, Marshall, Batterham & Hanin (2009, MSSE 41:3–12):
 * |d| < 0.2 trivial, < 0.6 small, < 1.2 moderate, < 2.0 large, < 4.0 very
 * large, else extremely large (thresholds from memory, METHODS.md §5 [M]).
 * Each threshold belongs to the band above it (0.2 is "small"). The sign is
 * ignored because direction is reported separately.
 *
 * The standardizer should be the between-athlete SD (baseline SD for
 * pre/post), not the SD of the changes (METHODS.md §5).
 *
 * @param standardisedChange change divided by the between-athlete SD
 * @returns a magnitude code
 * @throws {StatsInputError} when `standardisedChange` is not a finite number
 * @example
 * // Sleep data d_z 1.284558 (METHODS.md §5)
 * magnitudeOfEffect(1.284558); // => "large"
 */
export function magnitudeOfEffect(standardisedChange: number): Magnitude {
  assertFinite(standardisedChange, "The standardised change");
  const size = Math.abs(standardisedChange);
  let band = 0;
  while (band < MAGNITUDE_THRESHOLDS.length && size >= MAGNITUDE_THRESHOLDS[band]) band++;
  return BANDS[band];
}
