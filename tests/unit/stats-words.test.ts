import { describe, expect, it } from "vitest";
import { MAGNITUDE_THRESHOLDS, type Magnitude, magnitudeOfEffect, sensitivity, VERDICTS } from "@/lib/stats";
import {
  explainSensitivity,
  MAGNITUDE_LABELS,
  SENSITIVITY_LABELS,
  VERDICT_LABELS,
  verdictLabel,
} from "@/lib/words/stats";

// Magnitude-based-inference wording (METHODS.md §4.5) that PRODUCT.md §5 rules out everywhere.
const MBI_WORDING = /likely|possibly|probabl|almost certain|beneficial|harmful/i;

describe("verdict words (PRODUCT.md §5)", () => {
  it("lists every verdict with a plain label", () => {
    expect(VERDICTS.map(verdictLabel)).toEqual([
      "Clear gain",
      "Gain",
      "Steady",
      "Decline",
      "Clear decline",
      "Inconclusive",
    ]);
    expect(Object.keys(VERDICT_LABELS).sort()).toEqual([...VERDICTS].sort());
  });

  it("uses no probabilistic magnitude-based-inference wording", () => {
    for (const v of VERDICTS) expect(verdictLabel(v)).not.toMatch(MBI_WORDING);
  });
});

// The TE-versus-SWC comparison is common practice (METHODS.md §4.3); the wording is our own.
describe("sensitivity words", () => {
  it("names each rating", () => {
    // Duthie et al. 2006 10 m sprint: TE ≈ 0.02 s, SWC ≈ 0.01 s (METHODS.md §4.3)
    expect(SENSITIVITY_LABELS[sensitivity(0.02, 0.01).rating]).toBe("Noise hides the SWC");
    expect(SENSITIVITY_LABELS[sensitivity(1, 1).rating]).toBe("Needs repeated trials");
    expect(SENSITIVITY_LABELS[sensitivity(0.5, 1).rating]).toBe("Sees the SWC");
  });

  it("explains each rating with the ratio and, where it helps, the trials to average", () => {
    expect(explainSensitivity(sensitivity(0.02, 0.01))).toBe(
      "The typical error is 2.00 times the smallest worthwhile change, so test noise can hide or fake a worthwhile change. " +
        "Averaging 5 trials per test day brings the noise below the SWC.",
    );
    expect(explainSensitivity(sensitivity(1, 1))).toBe(
      "The typical error (1.00 × SWC) is about as large as the smallest worthwhile change, so one trial per test day is not " +
        "enough to tell them apart. Averaging 2 trials per test day brings the noise below the SWC.",
    );
    expect(explainSensitivity(sensitivity(0.5, 1))).toBe(
      "The typical error is 0.50 times the smallest worthwhile change, so a single retest can show a worthwhile change.",
    );
  });

  it("uses none of the traditional labels or probabilistic wording", () => {
    for (const te of [0.5, 1, 2]) {
      const s = sensitivity(te, 1);
      expect(`${SENSITIVITY_LABELS[s.rating]} ${explainSensitivity(s)}`).not.toMatch(
        /\bgood\b|\bOK\b|marginal|likely|possibly/i,
      );
    }
  });
});

// Hopkins, Marshall, Batterham & Hanin 2009 (MSSE 41:3–12) band names; thresholds from memory (METHODS.md §5 [M]).
describe("magnitude words", () => {
  it("names every band magnitudeOfEffect can return, in order", () => {
    const bands: Magnitude[] = [0, ...MAGNITUDE_THRESHOLDS].map((edge) => magnitudeOfEffect(edge));
    expect(bands.map((m) => MAGNITUDE_LABELS[m])).toEqual([
      "Trivial",
      "Small",
      "Moderate",
      "Large",
      "Very large",
      "Extremely large",
    ]);
  });

  it("uses no probabilistic magnitude-based-inference wording", () => {
    for (const label of Object.values(MAGNITUDE_LABELS)) expect(label).not.toMatch(MBI_WORDING);
  });
});
