import { describe, expect, it } from "vitest";
import { pairedPower, StatsInputError, tTestPower } from "@/lib/stats";
import { expectRelClose } from "./close";

describe("tTestPower: R power.t.test help-page examples (two-sample, sd 1, sig.level 0.05)", () => {
  // R's power.t.test defaults to strict = FALSE, which leaves out the wrong-tail term of a
  // two-sided test; these values are reproduced with strict: false.
  it("power.t.test(n = 20, delta = 1)$power = 0.8689528", () => {
    // R 4.2.2, METHODS.md §6 [C]
    expectRelClose(tTestPower({ n: 20, delta: 1, design: "two-sample", strict: false }), 0.8689528, 1e-7);
  });

  it("with the wrong-tail term the two-sided power is 2.3e-7 higher", () => {
    // computed with SciPy 1.17.1 stats.nct (sf + cdf), during development: 0.86895302772399
    const strict = tTestPower({ n: 20, delta: 1, design: "two-sample" });
    expectRelClose(strict, 0.86895302772399, 1e-8);
    expect(strict - tTestPower({ n: 20, delta: 1, design: "two-sample", strict: false })).toBeCloseTo(2.26e-7, 8);
  });
});

describe("pairedPower", () => {
  it("agrees with an independent SciPy value to 1e-9", () => {
    // computed with SciPy 1.17.1 (stats.nct; wrong tail included), during development
    expectRelClose(pairedPower({ n: 10, sdDiff: 1, delta: 1 }), 0.8030968566327219, 1e-9);
  });

  it("rejects fewer than 2 athletes, a non-positive sdDiff and alpha outside (0, 1)", () => {
    expect(() => pairedPower({ n: 1, sdDiff: 1, delta: 1 })).toThrow(/at least 2/);
    expect(() => pairedPower({ n: 10, sdDiff: 0, delta: 1 })).toThrow(StatsInputError);
    expect(() => pairedPower({ n: 10, sdDiff: 1, delta: 1, alpha: 1 })).toThrow(StatsInputError);
  });
});
