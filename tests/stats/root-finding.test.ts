import { describe, expect, it } from "vitest";
import { findRoot } from "@/lib/stats/root-finding";

// findRoot is internal to lib/stats (the sample-size solvers use it), so it is imported from its file.
// Reference roots computed with mpmath 1.3.0 findroot at 40 digits during this work.
describe("findRoot (Brent 1973)", () => {
  it("finds √2 as the root of x² − 2 on [0, 2]", () => {
    expect(Math.abs(findRoot((x) => x * x - 2, 0, 2) - Math.SQRT2)).toBeLessThan(1e-10);
  });

  it("finds the real root of Wallis's cubic x³ − 2x − 5, 2.0945514815423266", () => {
    // The classic test equation for root finders (common practice); mpmath: 2.09455148154232659148
    expect(Math.abs(findRoot((x) => x ** 3 - 2 * x - 5, 2, 3) - 2.0945514815423266)).toBeLessThan(1e-10);
    // A wide bracket costs iterations, not accuracy
    expect(Math.abs(findRoot((x) => x ** 3 - 2 * x - 5, -10, 10) - 2.0945514815423266)).toBeLessThan(1e-10);
  });

  it("finds the fixed point of cos, 0.7390851332151607", () => {
    // mpmath: 0.73908513321516064166
    expect(Math.abs(findRoot((x) => Math.cos(x) - x, 0, 1) - 0.7390851332151607)).toBeLessThan(1e-10);
  });

  it("accepts the bracket in either order", () => {
    expect(Math.abs(findRoot((x) => x * x - 2, 2, 0) - Math.SQRT2)).toBeLessThan(1e-10);
  });

  it("returns an end of the bracket that is itself a root", () => {
    expect(findRoot((x) => x - 1, 1, 3)).toBe(1);
    expect(findRoot((x) => x - 3, 1, 3)).toBe(3);
  });

  it("honours a looser tolerance", () => {
    const root = findRoot((x) => x * x - 2, 0, 2, { tolerance: 1e-3 });
    expect(Math.abs(root - Math.SQRT2)).toBeLessThan(1e-3);
  });

  it("returns its best estimate inside the bracket when the iterations run out", () => {
    const root = findRoot((x) => x * x - 2, 0, 2, { maxIterations: 2 });
    expect(root).toBeGreaterThan(0);
    expect(root).toBeLessThan(2);
  });

  it("locates a sign change even where the function jumps", () => {
    // Brent's method keeps a bracket, so bisection still closes in on a discontinuity
    expect(Math.abs(findRoot((x) => (x < 0.3 ? -1 : 1), 0, 1) - 0.3)).toBeLessThan(1e-9);
  });

  it("throws a RangeError when the interval does not bracket a root", () => {
    expect(() => findRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
    expect(() => findRoot((x) => x * x - 2, 2, 3)).toThrow("findRoot: the interval does not bracket a root.");
    expect(() => findRoot((x) => x * x - 2, -3, -2)).toThrow(RangeError);
  });
});
