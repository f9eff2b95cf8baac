import { StatsInputError } from "./errors";
import { assertFiniteScores } from "./validate";

export interface TwoWayMeanSquares {
  n: number;
  k: number;
  msr: number;
  msc: number;
  mse: number;
  msw: number;
  dfRows: number;
  dfColumns: number;
  dfError: number;
}

/**
 * Mean squares of the two-way (athletes × trials) ANOVA without replication,
 * the raw material of ICCs and of the typical error for k ≥ 2 trials.
 *
 * Shrout & Fleiss (1979, Psychol Bull 86:420–428); McGraw & Wong (1996,
 * Psychol Methods 1:30–46). For an n × k matrix x (rows = athletes,
 * columns = trials) with grand mean x̄:
 *   MSR = k·Σᵢ(x̄ᵢ. − x̄)²/(n − 1)           between athletes
 *   MSC = n·Σⱼ(x̄.ⱼ − x̄)²/(k − 1)           between trials
 *   MSE = ΣΣ(xᵢⱼ − x̄ᵢ. − x̄.ⱼ + x̄)²/((n − 1)(k − 1))   residual
 *   MSW = (SSC + SSE)/(n(k − 1))              within athletes (one-way)
 * The typical error for k trials is √MSE; for k = 2 it equals SD_d/√2.
 *
 * @param rows one row per athlete, one column per trial
 * @returns the four mean squares with n, k and their degrees of freedom
 * @throws {StatsInputError} when `rows` is not a table, has fewer than 2
 * athletes or 2 trials, has rows of unequal length, or holds a score that is
 * not a finite number
 * @example
 * // Weir (2005) dataset A, trials in columns (METHODS.md §3.6)
 * twoWayMeanSquares([[146, 140], [148, 152], [170, 152], [90, 99],
 *                    [157, 145], [156, 153], [176, 167], [205, 218]]).mse; // => 57.107…
 */
export function twoWayMeanSquares(rows: ArrayLike<ArrayLike<number>>): TwoWayMeanSquares {
  const { n, k } = checkShape(rows);
  const rowMeans = new Float64Array(n);
  const colMeans = new Float64Array(k);
  let grand = 0;
  for (let i = 0; i < n; i++) {
    const row = rows[i];
    let sum = 0;
    for (let j = 0; j < k; j++) {
      sum += row[j];
      colMeans[j] += row[j];
    }
    rowMeans[i] = sum / k;
    grand += sum;
  }
  grand /= n * k;
  for (let j = 0; j < k; j++) colMeans[j] /= n;

  let ssr = 0,
    ssc = 0,
    sse = 0;
  for (let i = 0; i < n; i++) ssr += (rowMeans[i] - grand) ** 2;
  for (let j = 0; j < k; j++) ssc += (colMeans[j] - grand) ** 2;
  ssr *= k;
  ssc *= n;
  for (let i = 0; i < n; i++) {
    const row = rows[i];
    for (let j = 0; j < k; j++) sse += (row[j] - rowMeans[i] - colMeans[j] + grand) ** 2;
  }
  const dfRows = n - 1,
    dfColumns = k - 1,
    dfError = dfRows * dfColumns;
  return {
    n,
    k,
    msr: ssr / dfRows,
    msc: ssc / dfColumns,
    mse: sse / dfError,
    msw: (ssc + sse) / (n * dfColumns),
    dfRows,
    dfColumns,
    dfError,
  };
}

function checkShape(rows: ArrayLike<ArrayLike<number>>): { n: number; k: number } {
  if (rows == null || typeof rows.length !== "number") {
    throw new StatsInputError("The scores must be a table with one row per athlete.");
  }
  const n = rows.length;
  if (n < 2) throw new StatsInputError(`At least 2 athletes are needed (got ${n}).`);
  const k = rows[0]?.length ?? 0;
  if (k < 2) throw new StatsInputError(`At least 2 trials per athlete are needed (got ${k}).`);
  for (let i = 0; i < n; i++) {
    if (rows[i]?.length !== k) {
      throw new StatsInputError(
        `Every athlete needs the same number of trials (athlete 1 has ${k}, athlete ${i + 1} has ${rows[i]?.length ?? 0}).`,
      );
    }
    assertFiniteScores(rows[i], `athlete ${i + 1}`);
  }
  return { n, k };
}
