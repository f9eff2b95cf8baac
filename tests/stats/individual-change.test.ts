import { describe, expect, it } from "vitest";
import { individualChange, minimalDetectableChange, StatsInputError } from "@/lib/stats";
import { expectDp } from "./close";

// Interval for true change = change ± q·√2·TE with q = t(ν) for a TE from a small study: from memory
// (METHODS.md §4.1 [M]), consistent with Swinton et al. 2018 (Front Nutr 5:41).
// METHODS.md §4.4 CMJ example (constructed numbers, computed [C]):
// pre 40.0 cm, post 42.5 cm, TE 1.0 cm on ν = 19, SWC 0.8 cm.
const CMJ = { pre: 40, post: 42.5, typicalError: 1, swc: 0.8 };

describe("individualChange: CMJ (higher is better)", () => {
  it("change and SE", () => {
    // METHODS.md §4.4 [C]: change 2.5, SE_change = √2 = 1.414214
    const r = individualChange(CMJ);
    expect(r.change).toBe(2.5);
    expectDp(r.standardError, 1.414214, 6);
    expect(r.betterChange).toBe(2.5);
    expect(r.confidence).toBe(0.9);
  });

  // METHODS.md §4.4 table [C]: z-based and t(19)-based intervals, 3 dp
  const table: Array<[number, [number, number], [number, number]]> = [
    [0.5, [1.546, 3.454], [1.528, 3.472]],
    [0.75, [0.873, 4.127], [0.822, 4.178]],
    [0.9, [0.174, 4.826], [0.055, 4.945]],
    [0.95, [-0.272, 5.272], [-0.46, 5.46]],
  ];
  it.each(table)("%s interval: z and t(19)", (confidence, zCi, tCi) => {
    const z = individualChange({ ...CMJ, confidence });
    expectDp(z.ciLower, zCi[0], 3);
    expectDp(z.ciUpper, zCi[1], 3);
    const t = individualChange({ ...CMJ, confidence, typicalErrorDf: 19 });
    expectDp(t.ciLower, tCi[0], 3);
    expectDp(t.ciUpper, tCi[1], 3);
    // t intervals are wider than z intervals
    expect(t.ciUpper - t.ciLower).toBeGreaterThan(z.ciUpper - z.ciLower);
  });

  it("verdicts follow the interval against the SWC band", () => {
    // METHODS.md §4.4 reading: the 90% CI overlaps the SWC, so not clearly > 0.8 at 90%.
    expect(individualChange({ ...CMJ, confidence: 0.9, typicalErrorDf: 19 }).verdict).toBe("gain");
    expect(individualChange({ ...CMJ, confidence: 0.9 }).verdict).toBe("gain");
    expect(individualChange({ ...CMJ, confidence: 0.5 }).verdict).toBe("clear-gain");
    expect(individualChange({ ...CMJ, confidence: 0.95 }).verdict).toBe("inconclusive");
  });

  it("MDC95, MDC90 and MDC80", () => {
    // METHODS.md §4.4 [C]: MDC90 = 2.32617, MDC80 = 1.81239 (exact z).
    expectDp(minimalDetectableChange(1, 0.9), 2.32617, 5);
    expectDp(minimalDetectableChange(1, 0.8), 1.81239, 5);
    // METHODS.md gives MDC95 = 2.77186, which is 1.96·√2 with z rounded to 1.96; with the exact
    // z = 1.959964 it is 2.771808 (computed: 1.959963984540054 × √2), so the METHODS value is
    // checked only to 3 dp.
    expectDp(minimalDetectableChange(1), 2.771808, 6);
    expectDp(minimalDetectableChange(1), 2.77186, 3);
    expect(minimalDetectableChange(1)).toBeCloseTo(1.96 * Math.SQRT2, 3);
  });

  it("the interval is symmetric about the change", () => {
    for (const confidence of [0.5, 0.9, 0.99]) {
      const r = individualChange({ ...CMJ, confidence, typicalErrorDf: 9 });
      expect(r.change - r.ciLower).toBeCloseTo(r.ciUpper - r.change, 12);
      expect(r.ciUpper - r.change).toBeCloseTo(r.quantile * r.standardError, 12);
    }
  });
});

describe("individualChange: 20 m sprint (lower is better)", () => {
  // METHODS.md §4.4 [C]: pre 3.10 s, post 3.05 s, CV 1% → TE 0.031 s; SWC 0.3 × CV = 0.0093 s
  const SPRINT = { pre: 3.1, post: 3.05, typicalError: 0.031, swc: 0.0093, higherIsBetter: false };

  it("raw change and intervals", () => {
    // METHODS.md §4.4 [C]: change −0.05, SE 0.0438406, 95% (−0.13593, 0.03593), 90% (−0.12211, 0.02211)
    const r95 = individualChange({ ...SPRINT, confidence: 0.95 });
    expectDp(r95.change, -0.05, 12);
    expectDp(r95.standardError, 0.0438406, 7);
    expectDp(r95.ciLower, -0.13593, 5);
    expectDp(r95.ciUpper, 0.03593, 5);
    const r90 = individualChange({ ...SPRINT, confidence: 0.9 });
    expectDp(r90.ciLower, -0.12211, 5);
    expectDp(r90.ciUpper, 0.02211, 5);
  });

  it("orients so that a faster time is a gain", () => {
    const r = individualChange({ ...SPRINT, confidence: 0.95 });
    expectDp(r.betterChange, 0.05, 12);
    expectDp(r.betterLower, -0.03593, 5);
    expectDp(r.betterUpper, 0.13593, 5);
    expect(r.verdict).toBe("inconclusive");
    // At 50% the interval (−0.0796, −0.0204) s is wholly faster than −SWC: a clear gain.
    expect(individualChange({ ...SPRINT, confidence: 0.5 }).verdict).toBe("clear-gain");
  });

  it("flips the verdict when the same numbers are read as higher-is-better", () => {
    // Property: orientation mirrors the verdict (gain ↔ decline, clear-gain ↔ clear-decline).
    const mirror = {
      "clear-gain": "clear-decline",
      gain: "decline",
      steady: "steady",
      decline: "gain",
      "clear-decline": "clear-gain",
      inconclusive: "inconclusive",
    } as const;
    for (const confidence of [0.5, 0.75, 0.9, 0.95]) {
      for (const post of [2.9, 3.0, 3.05, 3.09, 3.1, 3.12, 3.2, 3.3]) {
        const lower = individualChange({ ...SPRINT, post, confidence });
        const higher = individualChange({ ...SPRINT, post, confidence, higherIsBetter: true });
        expect(lower.verdict).toBe(mirror[higher.verdict]);
        expect(lower.betterChange).toBeCloseTo(-higher.betterChange, 15);
        expect(lower.ciLower).toBe(higher.ciLower);
      }
    }
  });
});

describe("individualChange: input errors", () => {
  it("rejects bad input", () => {
    expect(() => individualChange({ ...CMJ, typicalError: -1 })).toThrow(
      "The typical error cannot be negative (got -1).",
    );
    expect(() => individualChange({ ...CMJ, swc: -0.1 })).toThrow(StatsInputError);
    expect(() => individualChange({ ...CMJ, pre: NaN })).toThrow(StatsInputError);
    expect(() => individualChange({ ...CMJ, post: Infinity })).toThrow(StatsInputError);
    expect(() => individualChange({ ...CMJ, confidence: 1.2 })).toThrow(StatsInputError);
    expect(() => individualChange({ ...CMJ, typicalErrorDf: 0 })).toThrow(StatsInputError);
    expect(() => minimalDetectableChange(-1)).toThrow(StatsInputError);
    expect(() => minimalDetectableChange(1, 0)).toThrow(StatsInputError);
  });

  it("a zero TE gives a point interval", () => {
    const r = individualChange({ ...CMJ, typicalError: 0 });
    expect(r.ciLower).toBe(2.5);
    expect(r.ciUpper).toBe(2.5);
    expect(r.verdict).toBe("clear-gain");
  });
});
