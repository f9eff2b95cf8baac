/**
 * Changewise statistics core: pure functions for judging pre/post test changes.
 * They return numbers and codes only; words for people are in `lib/words/stats.ts`.
 * Formulas, sources and check values: ../../../shared/design/METHODS.md.
 */

export { mean, sampleSd, sampleVariance } from "./describe";
export {
  chiSquareQuantile,
  fQuantile,
  normalCdf,
  normalQuantile,
  studentTQuantile,
  studentTUpperTail,
} from "./distributions";
export { StatsInputError } from "./errors";
export { type IccResult, iccFromMeanSquares } from "./icc";
export {
  type IndividualChange,
  type IndividualChangeInput,
  individualChange,
  minimalDetectableChange,
} from "./individual-change";
export { MAGNITUDE_THRESHOLDS, type Magnitude, magnitudeOfEffect } from "./magnitude";
export { noncentralTCdf } from "./noncentral-t";
export { hedgesCorrection, type PairedChange, type PairedChangeOptions, pairedChange } from "./paired-change";
export { pairedPower, type TTestDesign, type TTestPowerOptions, tTestPower } from "./power";
export { type TestRetest, testRetest, typicalErrorLimits } from "./reliability";
export { pairedSampleSize, precisionSampleSize, type SampleSizeResult, tTestSampleSize } from "./sample-size";
export { SENSITIVITY_CUTOFFS, type Sensitivity, type SensitivityRating, sensitivity } from "./sensitivity";
export { smallestWorthwhileChange, swcFromCv } from "./swc";
export { tCritical, zCritical } from "./t-critical";
export { trialsToDetect } from "./trials";
export { type TwoWayMeanSquares, twoWayMeanSquares } from "./two-way-anova";
export { classifyChange, type Interval, orientInterval, VERDICTS, type Verdict } from "./verdict";
