import { studentTUpperTail } from "./distributions";
import { StatsInputError } from "./errors";
import { tCritical } from "./t-critical";
import { assertConfidence, assertPairs } from "./validate";

export interface PairedChangeOptions {
  /** Confidence level of the interval, default 0.90. */
  confidence?: number;
}

export interface PairedChange {
  n: number;
  df: number;
  confidence: number;
  meanPre: number;
  meanPost: number;
  meanDiff: number;
  sdDiff: number;
  standardError: number;
  tCritical: number;
  ciLower: number;
  ciUpper: number;
  /** null when every athlete changed by the same amount (SD_d = 0). */
  t: number | null;
  p: number | null;
  /** SD of the pre scores (n − 1), the standardizer for the SWC. */
  baselineSd: number;
  effectSizeDz: number | null;
  hedgesGz: number | null;
}

/**
 * Spreads this many ulps of the scores' scale below which SD_d counts as 0:
 * decimal inputs such as 1.1 → 1.2 and 2.2 → 2.3 give "equal" changes that
 * differ in the 16th digit, and a t of 10^15 from them would be noise.
 */
const ZERO_SPREAD_ULPS = 64;

/**
 * Mean change of a squad between two tests, with its paired t interval, t-test
 * and standardized effect sizes.
 *
 * With dᵢ = postᵢ − preᵢ (n pairs, df = n − 1):
 *   SE = SD_d/√n,  interval d̄ ± t_{1−α/2}(df)·SE,  t = d̄/SE,  p = 2·P(T_df ≥ |t|)
 * (Student 1908, Biometrika 6:1–25; R `t.test(paired = TRUE)`). Effect sizes
 * after Lakens (2013, Front Psychol 4:863): d_z = d̄/SD_d and Hedges'
 * g_z = d_z·J(df), see {@link hedgesCorrection}.
 *
 * The caller pairs the athletes: this function receives aligned arrays. One
 * pass over the scores, nothing allocated per score, so it stays O(n) for the
 * change report's large squads.
 *
 * @param pre each athlete's first score
 * @param post the same athletes' second scores, in the same order
 * @param options `confidence` of the interval (default 0.90)
 * @returns the summary; `t`, `p`, `effectSizeDz` and `hedgesGz` are null when
 * every athlete changed by the same amount (SD_d = 0)
 * @throws {StatsInputError} when the lists differ in length, hold fewer than 2
 * pairs, hold a score that is not a finite number, or sum beyond the range of
 * a double; or when `confidence` is not strictly between 0 and 1
 * @example
 * // Student's sleep data (R datasets::sleep), group 2 − group 1
 * const r = pairedChange(
 *   [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0],
 *   [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4],
 *   { confidence: 0.95 },
 * );
 * r.t; // => 4.062127683… (R: t = 4.0621)
 * r.ciLower; // => 0.7001142… (R: 0.7001142)
 */
export function pairedChange(
  pre: ArrayLike<number>,
  post: ArrayLike<number>,
  options: PairedChangeOptions = {},
): PairedChange {
  const confidence = options.confidence ?? 0.9;
  assertConfidence(confidence);
  const { n, meanPre, meanPost, meanDiff, sdDiff, baselineSd } = summarisePairs(pre, post);
  const df = n - 1;
  const standardError = sdDiff / Math.sqrt(n);
  const critical = tCritical(confidence, df);
  const halfWidth = critical * standardError;
  const result: PairedChange = {
    n,
    df,
    confidence,
    meanPre,
    meanPost,
    meanDiff,
    sdDiff,
    standardError,
    tCritical: critical,
    ciLower: meanDiff - halfWidth,
    ciUpper: meanDiff + halfWidth,
    t: null,
    p: null,
    baselineSd,
    effectSizeDz: null,
    hedgesGz: null,
  };
  if (sdDiff > 0) {
    const t = meanDiff / standardError;
    const dz = meanDiff / sdDiff;
    result.t = t;
    result.p = Math.min(1, 2 * studentTUpperTail(Math.abs(t), df));
    result.effectSizeDz = dz;
    result.hedgesGz = dz * hedgesCorrection(df);
  }
  return result;
}

interface PairSummary {
  n: number;
  meanPre: number;
  meanPost: number;
  meanDiff: number;
  sdDiff: number;
  baselineSd: number;
}

/**
 * Means and SDs (n − 1) of pre and of post − pre, validated, in one pass.
 *
 * The pass runs over shifted scores (x − first score): the shift keeps
 * Σx² − (Σx)²/n from cancelling catastrophically (Chan, Golub & LeVeque 1983,
 * Am Stat 37:242–247), so one pass is as accurate as two here. The loop checks
 * only typeof per score; NaN and ±Infinity are caught from the sums after it,
 * because they propagate. A per-score Number.isFinite made it 4× slower in V8.
 */
function summarisePairs(pre: ArrayLike<number>, post: ArrayLike<number>): PairSummary {
  if (pre == null || post == null || pre.length !== post.length || pre.length < 2) {
    assertPairs(pre, post, LABELS); // throws with the specific message
  }
  const n = pre.length;
  const shiftPre = pre[0];
  const shiftDiff = post[0] - pre[0];
  let sumPre = 0,
    sumSqPre = 0,
    sumDiff = 0,
    sumSqDiff = 0;
  for (let i = 0; i < n; i++) {
    const a = pre[i],
      b = post[i];
    if (typeof a !== "number" || typeof b !== "number") assertPairs(pre, post, LABELS);
    const x = a - shiftPre;
    const d = b - a - shiftDiff;
    sumPre += x;
    sumSqPre += x * x;
    sumDiff += d;
    sumSqDiff += d * d;
  }
  if (!Number.isFinite(sumPre + sumSqPre + sumDiff + sumSqDiff)) {
    assertPairs(pre, post, LABELS); // names the bad score, if there is one
    throw new StatsInputError("The scores are too large to analyse.");
  }
  const meanPre = shiftPre + sumPre / n;
  const meanDiff = shiftDiff + sumDiff / n;
  const meanPost = meanPre + meanDiff;
  const baselineSd = Math.sqrt(Math.max(0, sumSqPre - (sumPre * sumPre) / n) / (n - 1));
  let sdDiff = Math.sqrt(Math.max(0, sumSqDiff - (sumDiff * sumDiff) / n) / (n - 1));
  const scale = Math.max(Math.abs(meanPre), Math.abs(meanPost)) + baselineSd;
  if (sdDiff <= ZERO_SPREAD_ULPS * Number.EPSILON * scale) sdDiff = 0;
  return { n, meanPre, meanPost, meanDiff, sdDiff, baselineSd };
}

const LABELS = ["Pre", "post"] as const;

/**
 * Hedges' small-sample correction factor J, by which d is multiplied to give g.
 *
 * J = 1 − 3/(4·df − 1), the approximation in Lakens (2013, Front Psychol
 * 4:863), who writes it as 1 − 3/(4(n1 + n2) − 9) for two groups
 * (df = n1 + n2 − 2). The exact Γ-ratio form differs by less than 0.001 at
 * df = 9 (METHODS.md §5), far below the precision an effect size is read to.
 *
 * Does not throw: df should be above 1 for a J in (0, 1) (J(1) = 0, as for
 * the exact form); `pairedChange` passes n − 1 of a squad it has validated.
 *
 * @param df degrees of freedom: n − 1 for d_z, n1 + n2 − 2 for two groups
 * @returns J
 * @example
 * // Lakens (2013): d_s 1.12588 on 18 df gives g_s 1.07831
 * hedgesCorrection(18); // => 0.9577464788732395
 */
export function hedgesCorrection(df: number): number {
  return 1 - 3 / (4 * df - 1);
}
