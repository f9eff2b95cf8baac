import { describe, expect, it } from "vitest";
import { classifyChange, orientInterval, StatsInputError, VERDICTS, type Verdict } from "@/lib/stats";

// Rules: PRODUCT.md §5 (our own scheme), applied in order.
describe("classifyChange", () => {
  const swc = 1;
  const cases: Array<[string, number, number, Verdict]> = [
    // steady: inside [−swc, +swc], both ends inclusive
    ["steady, strictly inside", -0.5, 0.5, "steady"],
    ["steady, touching both ends", -1, 1, "steady"],
    ["steady, touching +swc", 0.2, 1, "steady"],
    ["steady, touching −swc", -1, -0.2, "steady"],
    ["steady, a point at 0", 0, 0, "steady"],
    // clear gain: lower > +swc (strict)
    ["clear gain", 1.2, 3, "clear-gain"],
    ["lower exactly at +swc is not clear", 1, 3, "gain"],
    // clear decline: upper < −swc (strict)
    ["clear decline", -3, -1.2, "clear-decline"],
    ["upper exactly at −swc is not clear", -3, -1, "decline"],
    // gain: lower > 0, reaching past +swc
    ["gain", 0.1, 2, "gain"],
    ["lower exactly 0 is not a gain", 0, 2, "inconclusive"],
    // decline: upper < 0, reaching past −swc
    ["decline", -2, -0.1, "decline"],
    ["upper exactly 0 is not a decline", -2, 0, "inconclusive"],
    // inconclusive: crosses 0 and leaves the band
    ["crosses 0 and +swc", -0.5, 1.5, "inconclusive"],
    ["crosses 0 and −swc", -1.5, 0.5, "inconclusive"],
    ["wider than the band both ways", -3, 3, "inconclusive"],
  ];
  it.each(cases)("%s: [%s, %s]", (_name, lower, upper, verdict) => {
    expect(classifyChange({ lower, upper }, swc)).toBe(verdict);
  });

  it("steady takes precedence (a zero SWC makes the band a point)", () => {
    expect(classifyChange({ lower: 0, upper: 0 }, 0)).toBe("steady");
    expect(classifyChange({ lower: 0.1, upper: 0.2 }, 0)).toBe("clear-gain");
    expect(classifyChange({ lower: -0.2, upper: -0.1 }, 0)).toBe("clear-decline");
    expect(classifyChange({ lower: -0.2, upper: 0.1 }, 0)).toBe("inconclusive");
  });

  it("rejects bad input", () => {
    expect(() => classifyChange({ lower: 2, upper: 1 }, 1)).toThrow(StatsInputError);
    expect(() => classifyChange({ lower: NaN, upper: 1 }, 1)).toThrow(StatsInputError);
    expect(() => classifyChange({ lower: 0, upper: 1 }, -1)).toThrow(StatsInputError);
    expect(() => classifyChange({ lower: 0, upper: 1 }, NaN)).toThrow(StatsInputError);
  });
});

describe("orientInterval", () => {
  it("keeps higher-is-better intervals and negates-and-swaps lower-is-better ones", () => {
    expect(orientInterval(-0.12, 0.02, true)).toEqual({ lower: -0.12, upper: 0.02 });
    expect(orientInterval(-0.12, 0.02, false)).toEqual({ lower: -0.02, upper: 0.12 });
    expect(orientInterval(0, 1, false)).toEqual({ lower: -1, upper: 0 });
    expect(Object.is(orientInterval(0, 1, false).upper, 0)).toBe(true);
  });

  it("flips every verdict into its mirror image", () => {
    const mirror: Record<Verdict, Verdict> = {
      "clear-gain": "clear-decline",
      gain: "decline",
      steady: "steady",
      decline: "gain",
      "clear-decline": "clear-gain",
      inconclusive: "inconclusive",
    };
    for (let lower = -3; lower <= 3; lower += 0.25) {
      for (let upper = lower; upper <= 3.5; upper += 0.25) {
        const up = classifyChange(orientInterval(lower, upper, true), 1);
        const down = classifyChange(orientInterval(lower, upper, false), 1);
        expect(down).toBe(mirror[up]);
      }
    }
  });
});

// The words shown for each verdict are checked in tests/unit/stats-words.test.ts.
describe("verdict codes", () => {
  it("lists every verdict code, best to worst, then the undecided one", () => {
    expect(VERDICTS).toEqual(["clear-gain", "gain", "steady", "decline", "clear-decline", "inconclusive"]);
  });
});
