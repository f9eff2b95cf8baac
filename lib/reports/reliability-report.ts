/**
 * The Reliability check as one pure function: two sessions of the same athletes on one test,
 * turned into the test's noise (typical error, CV%), its systematic shift (change in mean), its
 * retest correlation (ICC(3,1) and ICC(2,1)), what that means against the SWC, and the Planner.
 * No formula lives here; each comes from lib/stats.
 */

import type { ResultFlag } from "@/lib/domain";
import {
  type PairedChange,
  pairedChange,
  pairedSampleSize,
  StatsInputError,
  sensitivity,
  testRetest,
  trialsToDetect,
  zCritical,
} from "@/lib/stats";
import { type ExclusionReason, exclusionOf, type ReportRow, type ReportTest, reportSwc } from "./change-report";
import { kooLiBand, PLANNER_POWERS } from "./reliability-bands";

export { type KooLiBand, kooLiBand, PLANNER_POWERS } from "./reliability-bands";

export type ReliabilityInput = {
  test: Pick<ReportTest, "swcMethod" | "swcValue" | "cvPercent">;
  rows: ReportRow[];
  confidence: number;
};

/**
 * Composes the Reliability check from each athlete's scores in the two sessions (`pre` is the
 * first session, `post` the second). Missing and flagged scores are left out and listed.
 * @throws {StatsInputError} when fewer than 2 athletes have a score in both sessions, or the
 * test's SWC cannot be computed
 */
export function buildReliabilityReport({ test, rows, confidence }: ReliabilityInput) {
  const pairs: { athleteId: number; name: string; first: number; second: number }[] = [];
  const excluded: { athleteId: number; name: string; reason: ExclusionReason; flag: ResultFlag | null }[] = [];
  for (const row of rows) {
    const reason = exclusionOf(row);
    if (reason) {
      // Someone on the squad with no score on either day was not part of the study.
      if (row.pre !== null || row.post !== null)
        excluded.push({
          athleteId: row.athleteId,
          name: row.name,
          reason,
          flag: row.pre?.flag ?? row.post?.flag ?? null,
        });
      continue;
    }
    pairs.push({ athleteId: row.athleteId, name: row.name, first: row.pre!.value!, second: row.post!.value! });
  }
  if (pairs.length < 2) throw new StatsInputError("At least two athletes need an unflagged score in both sessions.");

  const first = pairs.map((p) => p.first);
  const second = pairs.map((p) => p.second);
  const study = testRetest(first, second, { confidence });
  const change: PairedChange = pairedChange(first, second, { confidence });
  const te = study.typicalError;
  // A CV-based SWC needs a CV: the test's own, else the one this study measured.
  const swc = reportSwc({ method: test.swcMethod, value: test.swcValue }, first, test.cvPercent ?? study.cvPercent);
  const canPlan = te > 0 && swc > 0;
  const athletesAt = (power: number) => {
    if (!canPlan) return null;
    try {
      // Each athlete's change carries the error of two tests: SD of changes = √2·TE.
      return pairedSampleSize({ sdDiff: Math.SQRT2 * te, delta: swc, power }).n;
    } catch (error) {
      if (error instanceof StatsInputError) return null;
      throw error;
    }
  };
  const halfWidth = zCritical(0.95) * change.sdDiff;

  return {
    n: study.n,
    df: study.df,
    confidence,
    typicalError: te,
    typicalErrorLower: study.typicalErrorLower,
    typicalErrorUpper: study.typicalErrorUpper,
    cvPercent: study.cvPercent,
    changeInMean: study.changeInMean,
    changeLower: change.ciLower,
    changeUpper: change.ciUpper,
    icc31: study.icc31,
    icc31Lower: study.icc31Lower,
    icc31Upper: study.icc31Upper,
    icc21: study.icc21,
    icc21Lower: study.icc21Lower,
    icc21Upper: study.icc21Upper,
    iccReading: study.icc31 === null ? null : kooLiBand(study.icc31),
    /** Bland & Altman's 95 % limits of agreement: change in mean ± 1.96·SD of the differences. */
    limitsOfAgreement: { lower: study.changeInMean - halfWidth, upper: study.changeInMean + halfWidth },
    swc,
    sensitivity: swc > 0 ? sensitivity(te, swc) : null,
    athletesNeeded: athletesAt(0.8),
    trialsNeeded: swc > 0 ? trialsToDetect(te, swc) : null,
    planner: PLANNER_POWERS.map((power) => ({ power, athletes: athletesAt(power) })),
    pairs,
    excluded,
  };
}

export type ReliabilityReport = ReturnType<typeof buildReliabilityReport>;
