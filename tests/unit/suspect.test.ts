import { describe, expect, it } from "vitest";
import {
  HISTORY_BETWEEN_SDS,
  HISTORY_TYPICAL_ERRORS,
  type SuspectContext,
  suspectReasons,
  suspectTrials,
  TRIAL_RELATIVE,
  TRIAL_TYPICAL_ERRORS,
} from "@/lib/suspect";
import { suspectSentence } from "@/lib/words/suspect";

// A 10 m sprint as the demo club's Test library holds it: plausible 1.5–2.6 s, TE 0.03 s
// (invented figures of the size sprint timing gates give).
const sprint: SuspectContext = {
  plausibleMin: 1.5,
  plausibleMax: 2.6,
  typicalError: 0.03,
  betweenAthleteSd: 0.08,
  previous: 1.79,
};
const codes = (value: number, trials: (number | null)[], ctx: SuspectContext) =>
  suspectReasons(value, trials, ctx).map((r) => r.code);

describe("suspectReasons", () => {
  it("finds the slipped decimal point of 17.60 for 1.76 on all three counts", () => {
    expect(codes(17.6, [1.78, 17.6, 1.8], sprint)).toEqual([
      "outside-plausible",
      "far-from-history",
      "far-from-trials",
    ]);
  });

  it("leaves ordinary scores alone, the typo's neighbours included", () => {
    expect(codes(1.78, [1.78, 17.6, 1.8], sprint)).toEqual([]);
    expect(codes(1.8, [1.78, 17.6, 1.8], sprint)).toEqual([]);
    expect(codes(1.74, [1.74], sprint)).toEqual([]);
  });

  it("measures the distance from history in typical errors: 6 × 0.03 s = 0.18 s", () => {
    expect(HISTORY_TYPICAL_ERRORS).toBe(6);
    expect(codes(1.79 + 0.17, [], sprint)).toEqual([]);
    const [reason] = suspectReasons(1.79 + 0.19, [], sprint);
    expect(reason).toMatchObject({ code: "far-from-history", previous: 1.79, basis: "typical-error" });
    if (reason.code === "far-from-history") expect(reason.limit).toBeCloseTo(0.18, 12);
  });

  it("falls back to between-athlete SDs without a typical error, and to nothing without either", () => {
    const noTe = { ...sprint, typicalError: null };
    expect(HISTORY_BETWEEN_SDS).toBe(1.5);
    expect(codes(1.79 + 0.11, [], noTe)).toEqual([]); // 1.5 × 0.08 = 0.12
    expect(codes(1.79 + 0.13, [], noTe)).toEqual(["far-from-history"]);
    expect(codes(2.4, [], { ...noTe, betweenAthleteSd: null })).toEqual([]);
    expect(codes(2.4, [], { ...sprint, previous: null })).toEqual([]);
  });

  it("compares trials with their median: 4 typical errors, or 15 % without one", () => {
    expect(TRIAL_TYPICAL_ERRORS).toBe(4);
    expect(TRIAL_RELATIVE).toBe(0.15);
    const fresh = { ...sprint, previous: null };
    expect(codes(1.94, [1.8, 1.81, 1.94], fresh)).toEqual(["far-from-trials"]); // 0.13 s from the median 1.81 > 0.12
    expect(codes(1.92, [1.8, 1.81, 1.92], fresh)).toEqual([]); // 0.11 s

    const cmj = { plausibleMin: null, plausibleMax: null, typicalError: null, betweenAthleteSd: null, previous: null };
    expect(codes(46, [40, 40.5, 46], cmj)).toEqual([]); // 5.5 cm from 40.5 is under 15 % (6.075)
    expect(codes(47, [40, 40.5, 47], cmj)).toEqual(["far-from-trials"]);
  });

  it("marks both of two trials that disagree, since the trials alone cannot tell which is wrong", () => {
    const fresh = { ...sprint, previous: null, plausibleMax: null };
    expect(suspectTrials(7, 3, [1.8, 2.8], fresh).map((s) => s.trial)).toEqual([1, 2]);
  });

  it("of two trials that disagree, names only the one that is also out of range", () => {
    const cmj = { plausibleMin: 15, plausibleMax: 70, typicalError: null, betweenAthleteSd: null, previous: null };
    expect(suspectTrials(7, 1, [3.85, 38.5], cmj).map((s) => [s.trial, s.value])).toEqual([[1, 3.85]]);
  });

  it("names only the farthest of several trials that are all far from the last published score", () => {
    // A real jump in form moves every trial: one note for the result, not three.
    const cmj = { plausibleMin: 15, plausibleMax: 70, typicalError: null, betweenAthleteSd: 2.7, previous: 35 };
    expect(suspectTrials(7, 1, [42, 40.8, 41.5], cmj).map((s) => [s.trial, s.value])).toEqual([[1, 42]]);
  });

  it("respects each end of the plausible range on its own", () => {
    expect(codes(1.2, [], { ...sprint, previous: null, plausibleMax: null })).toEqual(["outside-plausible"]);
    expect(codes(3, [], { ...sprint, previous: null, plausibleMin: null })).toEqual(["outside-plausible"]);
  });
});

describe("suspectTrials and the words", () => {
  it("reports each suspect trial with its number and value, in the API's shape", () => {
    const found = suspectTrials(11, 2, [1.78, 17.6, 1.8, null], sprint);
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ athleteId: 11, testId: 2, trial: 2, value: 17.6 });
    expect(suspectSentence(found[0].reasons, { unit: "s", decimals: 2 })).toBe(
      "outside the plausible range 1.5–2.6 s; far from the last published 1.79 s (more than 6 typical errors, 0.18 s); far from the other trials (median 1.80 s)",
    );
  });
});
