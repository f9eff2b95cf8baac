import { describe, expect, it } from "vitest";
import { sensitivity, magnitudeOfEffect, trialsToDetect, StatsInputError } from "@/lib/stats";

// Comparing TE with the SWC is common practice, usually credited to Hopkins 2004 (Sportscience 8:1–7;
// exact wording not confirmed, METHODS.md §4.3). The 0.8 and 1.2 cut-offs are our own convention.
describe("sensitivity (our own TE/SWC rating; cut-offs 0.8 and 1.2 are our convention)", () => {
  it("rates a 10 m sprint with TE twice the SWC as blind", () => {
    // Duthie et al. 2006, JSCR 20:246–251 (METHODS.md §4.3/§7): TE ≈ 0.02 s, SWC ≈ 0.01 s
    const s = sensitivity(0.02, 0.01);
    expect(s.rating).toBe("blind");
    expect(s.ratio).toBeCloseTo(2, 12);
    expect(s.label).toBe("Noise hides the SWC");
    expect(s.trialsNeeded).toBe(5);
  });

  it("0–20 m sprint where SWC > TE sees the SWC", () => {
    // Holmberg et al. 2025 (METHODS.md §7) report SWC > TE for 0–20 m; illustrative SWC 0.04 s vs TE 0.025 s
    expect(sensitivity(0.025, 0.04).rating).toBe("detects");
  });

  it("applies the cut-offs at their edges", () => {
    expect(sensitivity(0.79, 1).rating).toBe("detects");
    expect(sensitivity(0.8, 1).rating).toBe("borderline");
    expect(sensitivity(1.2, 1).rating).toBe("borderline");
    expect(sensitivity(1.21, 1).rating).toBe("blind");
    expect(sensitivity(0, 1).rating).toBe("detects");
    // decimal inputs exactly at a cut-off, which are off by one ulp in binary
    expect(0.08 / 0.1).toBeLessThan(0.8);
    expect(sensitivity(0.08, 0.1).rating).toBe("borderline");
    expect(0.684 / 0.57).toBeGreaterThan(1.2);
    expect(sensitivity(0.684, 0.57).rating).toBe("borderline");
    expect(sensitivity(1, 1).label).toBe("Needs repeated trials");
    expect(sensitivity(0.5, 1).label).toBe("Sees the SWC");
  });

  it("uses none of the traditional labels or probabilistic wording", () => {
    for (const te of [0.5, 1, 2]) {
      const s = sensitivity(te, 1);
      expect(`${s.label} ${s.explanation}`).not.toMatch(/\bgood\b|\bOK\b|marginal|likely|possibly/i);
    }
  });

  it("rejects bad input", () => {
    expect(() => sensitivity(-1, 1)).toThrow(StatsInputError);
    expect(() => sensitivity(1, 0)).toThrow(StatsInputError);
    expect(() => sensitivity(1, -1)).toThrow(StatsInputError);
  });
});

describe("trialsToDetect", () => {
  it("smallest k with TE/√k < SWC", () => {
    expect(trialsToDetect(0.5, 1)).toBe(1);
    expect(trialsToDetect(1, 1)).toBe(2); // TE/√1 = SWC is not below it
    expect(trialsToDetect(2, 1)).toBe(5); // exact square: √4 gives 1, not < 1
    expect(trialsToDetect(1.5, 1)).toBe(3); // 1.5/√3 = 0.866
    expect(trialsToDetect(0.3, 0.1)).toBe(10); // 0.3/0.1 is 2.9999999999999996 in floats
    expect(trialsToDetect(0, 1)).toBe(1);
    for (const [te, swc] of [[0.7, 0.3], [3, 1], [0.021, 0.0093]]) {
      const k = trialsToDetect(te, swc);
      expect(te / Math.sqrt(k)).toBeLessThan(swc);
      if (k > 1) expect(te / Math.sqrt(k - 1)).toBeGreaterThanOrEqual(swc);
    }
  });

  it("rejects bad input", () => {
    expect(() => trialsToDetect(-1, 1)).toThrow(StatsInputError);
    expect(() => trialsToDetect(1, 0)).toThrow(StatsInputError);
  });
});

// Hopkins, Marshall, Batterham & Hanin 2009 (MSSE 41:3–12); the exact thresholds are from memory
// (METHODS.md §5 marks them [M]), matching PRODUCT.md §4.
describe("magnitudeOfEffect (Hopkins et al. 2009 scale, METHODS.md §5)", () => {
  it("bands on 0.2/0.6/1.2/2.0/4.0 using |value|", () => {
    expect(magnitudeOfEffect(0)).toBe("trivial");
    expect(magnitudeOfEffect(0.19)).toBe("trivial");
    expect(magnitudeOfEffect(0.2)).toBe("small");
    expect(magnitudeOfEffect(-0.59)).toBe("small");
    expect(magnitudeOfEffect(0.6)).toBe("moderate");
    expect(magnitudeOfEffect(1.2)).toBe("large");
    expect(magnitudeOfEffect(-1.999)).toBe("large");
    expect(magnitudeOfEffect(2)).toBe("very large");
    expect(magnitudeOfEffect(4)).toBe("extremely large");
    expect(magnitudeOfEffect(-12)).toBe("extremely large");
    // Sleep-data d_z 1.284558 (METHODS.md §5) is "large"
    expect(magnitudeOfEffect(1.284558)).toBe("large");
  });

  it("rejects non-finite values", () => {
    expect(() => magnitudeOfEffect(NaN)).toThrow(StatsInputError);
    expect(() => magnitudeOfEffect(Infinity)).toThrow(StatsInputError);
  });
});
