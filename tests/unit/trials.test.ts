import { describe, expect, it } from "vitest";
import { isStorableTrial, MAX_TRIAL_MAGNITUDE, reduceTrials } from "@/lib/trials";
import { trialValue } from "@/lib/validation/sessions";

describe("trial magnitude limit (shared by the Session sheet schema and the import)", () => {
  it("accepts finite scores up to ±1e9 and nothing else", () => {
    for (const v of [0, -0, 1.86, -MAX_TRIAL_MAGNITUDE, MAX_TRIAL_MAGNITUDE]) expect(isStorableTrial(v)).toBe(true);
    for (const v of [Infinity, -Infinity, NaN, 1e308, -1e308, MAX_TRIAL_MAGNITUDE + 1])
      expect(isStorableTrial(v)).toBe(false);
    expect(trialValue.safeParse(1e308).success).toBe(false);
    expect(trialValue.safeParse(null).success).toBe(true);
    expect(trialValue.safeParse(1e9).success).toBe(true);
  });

  it("ten trials at the limit reduce to a finite mean", () => {
    expect(reduceTrials(Array(10).fill(MAX_TRIAL_MAGNITUDE), "mean", "higher")).toBe(MAX_TRIAL_MAGNITUDE);
  });

  it("a mean of stored values that overflow their sum stays finite (scores stored before the limit)", () => {
    expect(reduceTrials([1e308, 1e308], "mean", "higher")).toBe(1e308);
    expect(reduceTrials([-1.7e308, -1.7e308, null], "mean", "lower")).toBe(-1.7e308);
    // Ordinary means are computed exactly as before (sum ÷ count).
    expect(reduceTrials([1.82, 1.79, 1.8], "mean", "lower")).toBe((1.82 + 1.79 + 1.8) / 3);
  });
});
