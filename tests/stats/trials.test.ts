import { describe, expect, it } from "vitest";
import { StatsInputError, trialsToDetect } from "@/lib/stats";

// The error of a mean of k trials is TE/√k (standard error of a mean; PRODUCT.md §4, planning).
describe("trialsToDetect", () => {
  it("smallest k with TE/√k < SWC", () => {
    expect(trialsToDetect(0.5, 1)).toBe(1);
    expect(trialsToDetect(1, 1)).toBe(2); // TE/√1 = SWC is not below it
    expect(trialsToDetect(2, 1)).toBe(5); // exact square: √4 gives 1, not < 1
    expect(trialsToDetect(1.5, 1)).toBe(3); // 1.5/√3 = 0.866
    expect(trialsToDetect(0.3, 0.1)).toBe(10); // 0.3/0.1 is 2.9999999999999996 in floats
    expect(trialsToDetect(0, 1)).toBe(1);
    for (const [te, swc] of [
      [0.7, 0.3],
      [3, 1],
      [0.021, 0.0093],
    ]) {
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
