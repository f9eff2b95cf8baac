import { expect } from "vitest";

/** |actual − expected| ≤ rel·|expected|, for values quoted to 7+ significant digits. */
export function expectRelClose(actual: number | null | undefined, expected: number, rel = 1e-6): void {
  expect(actual).not.toBeNull();
  expect(actual).toBeDefined();
  const err = Math.abs((actual as number) - expected);
  expect(err, `${actual} vs ${expected} (rel err ${err / Math.abs(expected)})`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/**
 * Agreement to the decimals a source prints: |actual − expected| < ½·10^−dp,
 * i.e. `actual` rounds to the printed value.
 */
export function expectDp(actual: number | null | undefined, expected: number, dp: number): void {
  expect(actual).not.toBeNull();
  expect(actual).toBeDefined();
  expect(actual as number).toBeCloseTo(expected, dp);
}
