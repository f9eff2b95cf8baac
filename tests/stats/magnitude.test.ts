import { describe, expect, it } from "vitest";
import { magnitudeOfEffect, StatsInputError } from "@/lib/stats";

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
