/**
 * Changewise statistics core: pure functions for judging pre/post test changes.
 * They return numbers and codes only; words for people are in `lib/words/stats.ts`.
 * Formulas, sources and check values: ../../../shared/design/METHODS.md.
 */
export { StatsInputError } from "./errors";
export { mean, sampleVariance, sampleSd } from "./describe";
export {
  normalCdf,
  normalQuantile,
  studentTQuantile,
  studentTUpperTail,
  chiSquareQuantile,
  fQuantile,
} from "./distributions";
export { noncentralTCdf } from "./noncentral-t";
export { tCritical, zCritical } from "./t-critical";
export { pairedChange, hedgesCorrection, type PairedChange, type PairedChangeOptions } from "./paired-change";
export { smallestWorthwhileChange, swcFromCv } from "./swc";
export { twoWayMeanSquares, type TwoWayMeanSquares } from "./two-way-anova";
export { iccFromMeanSquares, type IccResult } from "./icc";
export { testRetest, typicalErrorLimits, type TestRetest } from "./reliability";
export {
  individualChange,
  minimalDetectableChange,
  type IndividualChange,
  type IndividualChangeInput,
} from "./individual-change";
export { classifyChange, orientInterval, VERDICTS, type Verdict, type Interval } from "./verdict";
export { pairedPower, tTestPower, type TTestDesign, type TTestPowerOptions } from "./power";
export { pairedSampleSize, precisionSampleSize, tTestSampleSize, type SampleSizeResult } from "./sample-size";
export { trialsToDetect } from "./trials";
export { sensitivity, SENSITIVITY_CUTOFFS, type Sensitivity, type SensitivityRating } from "./sensitivity";
export { magnitudeOfEffect, MAGNITUDE_THRESHOLDS, type Magnitude } from "./magnitude";
