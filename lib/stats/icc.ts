import { fQuantile } from "./distributions";
import type { TwoWayMeanSquares } from "./two-way-anova";
import { assertConfidence } from "./validate";

export interface IccResult {
  confidence: number;
  icc31: number | null;
  icc31Lower: number | null;
  icc31Upper: number | null;
  icc21: number | null;
  icc21Lower: number | null;
  icc21Upper: number | null;
  /** Satterthwaite df used for the ICC(2,1) limits. */
  icc21Df: number | null;
}

/**
 * Intraclass correlations ICC(3,1) (consistency) and ICC(2,1) (absolute
 * agreement), with confidence limits, from two-way mean squares.
 *
 * Shrout & Fleiss (1979, Psychol Bull 86:420–428); McGraw & Wong (1996,
 * Psychol Methods 1:30–46), where they are ICC(C,1) and ICC(A,1):
 *   ICC(3,1) = (MSR − MSE)/(MSR + (k − 1)MSE)
 *   ICC(2,1) = (MSR − MSE)/(MSR + (k − 1)MSE + k(MSC − MSE)/n)
 * Limits for ICC(3,1) from F0 = MSR/MSE:
 *   FL = F0/F_{1−α/2}(n − 1, (n − 1)(k − 1)),  FU = F0·F_{1−α/2}((n − 1)(k − 1), n − 1),
 *   [(FL − 1)/(FL + k − 1), (FU − 1)/(FU + k − 1)].
 * Limits for ICC(2,1) use the Satterthwaite df v of METHODS.md §3.3 (as in
 * McGraw & Wong 1996 and the R `psych` documentation). Read the limits, not
 * the point value, against Koo & Li (2016, J Chiropr Med 15:155–163).
 *
 * A value is null where the data cannot support it (e.g. every score equal,
 * or no residual variation for an F ratio), rather than NaN or ±Infinity.
 *
 * @param ms mean squares from `twoWayMeanSquares`
 * @param options `confidence` of the limits (default 0.95)
 * @returns both ICCs, their limits, and the Satterthwaite df
 * @throws {StatsInputError} when `confidence` is not strictly between 0 and 1
 * @example
 * // Shrout & Fleiss (1979) Table 2: 6 targets × 4 judges (METHODS.md §3.4)
 * const table = [[9, 2, 5, 8], [6, 1, 3, 2], [8, 4, 6, 8], [7, 1, 2, 6], [10, 5, 6, 9], [6, 2, 4, 7]];
 * iccFromMeanSquares(twoWayMeanSquares(table)).icc21; // => 0.289763… (published: 0.29)
 */
export function iccFromMeanSquares(ms: TwoWayMeanSquares, options: { confidence?: number } = {}): IccResult {
  const confidence = options.confidence ?? 0.95;
  assertConfidence(confidence);
  const p = 1 - (1 - confidence) / 2;
  return { confidence, ...consistency(ms, p), ...agreement(ms, p) };
}

function consistency({ n, k, msr, mse }: TwoWayMeanSquares, p: number) {
  const icc31 = finiteOrNull((msr - mse) / (msr + (k - 1) * mse));
  const f0 = msr / mse;
  const fl = f0 / fQuantile(p, n - 1, (n - 1) * (k - 1));
  const fu = f0 * fQuantile(p, (n - 1) * (k - 1), n - 1);
  return {
    icc31,
    icc31Lower: icc31 === null ? null : finiteOrNull((fl - 1) / (fl + k - 1)),
    icc31Upper: icc31 === null ? null : finiteOrNull((fu - 1) / (fu + k - 1)),
  };
}

function agreement({ n, k, msr, msc, mse }: TwoWayMeanSquares, p: number) {
  const icc21 = finiteOrNull((msr - mse) / (msr + (k - 1) * mse + (k * (msc - mse)) / n));
  if (icc21 === null) return { icc21, icc21Lower: null, icc21Upper: null, icc21Df: null };
  const r = icc21;
  const fj = msc / mse;
  const spread = n * (1 + (k - 1) * r) - k * r;
  const v = finiteOrNull(
    ((k - 1) * (n - 1) * (k * r * fj + spread) ** 2) / ((n - 1) * k * k * r * r * fj * fj + spread * spread),
  );
  if (v === null || v <= 0) return { icc21, icc21Lower: null, icc21Upper: null, icc21Df: v };
  const fLow = fQuantile(p, n - 1, v);
  const fHigh = fQuantile(p, v, n - 1);
  const mixed = k * msc + (k * n - k - n) * mse;
  return {
    icc21,
    icc21Lower: finiteOrNull((n * (msr - fLow * mse)) / (fLow * mixed + n * msr)),
    icc21Upper: finiteOrNull((n * (fHigh * msr - mse)) / (mixed + n * fHigh * msr)),
    icc21Df: v,
  };
}

function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}
