import { describe, expect, it } from "vitest";
import { StatsInputError, sensitivity } from "@/lib/stats";

// Comparing TE with the SWC is common practice, usually credited to Hopkins 2004 (Sportscience 8:1–7;
// exact wording not confirmed, METHODS.md §4.3). The 0.8 and 1.2 cut-offs are our own convention.
// The words shown for each rating are checked in tests/unit/stats-words.test.ts.
describe("sensitivity (our own TE/SWC rating; cut-offs 0.8 and 1.2 are our convention)", () => {
  it("rates a 10 m sprint with TE twice the SWC as blind", () => {
    // Duthie et al. 2006, JSCR 20:246–251 (METHODS.md §4.3/§7): TE ≈ 0.02 s, SWC ≈ 0.01 s
    const s = sensitivity(0.02, 0.01);
    expect(s.rating).toBe("blind");
    expect(s.ratio).toBeCloseTo(2, 12);
    expect(s.trialsNeeded).toBe(5);
  });

  it("returns a code and numbers only, no text for people", () => {
    expect(Object.keys(sensitivity(0.02, 0.01)).sort()).toEqual(["rating", "ratio", "trialsNeeded"]);
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
  });

  it("rejects bad input", () => {
    expect(() => sensitivity(-1, 1)).toThrow(StatsInputError);
    expect(() => sensitivity(1, 0)).toThrow(StatsInputError);
    expect(() => sensitivity(1, -1)).toThrow(StatsInputError);
  });
});
