import { describe, expect, it } from "vitest";
import { parseScore } from "@/lib/import/numbers";

describe("parseScore", () => {
  it("reads decimal points everywhere and decimal commas outside comma-separated files", () => {
    expect(parseScore("1.86", ",")).toEqual(1.86);
    expect(parseScore(" 34 ", ",")).toEqual(34);
    expect(parseScore("-0.5", ",")).toEqual(-0.5);
    expect(parseScore(".5", ",")).toEqual(0.5);
    expect(parseScore("1,86", ";")).toEqual(1.86);
    expect(parseScore("1,86", "\t")).toEqual(1.86);
    expect(parseScore("1480", ";")).toEqual(1480);
  });

  it("treats an empty cell as an empty trial", () => {
    expect(parseScore("", ",")).toEqual(null);
    expect(parseScore("   ", ";")).toEqual(null);
  });

  it("refuses what it would have to guess, with a reason", () => {
    const refused = (raw: string, d: "," | ";" = ";") => {
      const r = parseScore(raw, d);
      expect(typeof r).toBe("string");
      return r as string;
    };
    expect(refused("1,500", ",")).toMatch(/ambiguous/);
    expect(refused("1.234,5")).toMatch(/thousands/);
    expect(refused("1 480")).toMatch(/thousands/);
    expect(refused("2.31s")).toMatch(/unit/);
    expect(refused("34 cm")).toMatch(/unit/);
    expect(refused("DNS")).toMatch(/not a number/);
    expect(refused("NaN")).toMatch(/not a number/);
    expect(refused("Infinity")).toMatch(/not a number/);
    expect(refused("1e3")).toMatch(/unit|not a number/);
  });
});

describe("parseScore: numbers that cannot be stored as written", () => {
  it("refuses non-finite and out-of-range values with the cell text (clipped) and the range", () => {
    const huge = `1${"0".repeat(400)}`; // Number(huge) is Infinity: it would be stored as an empty trial
    const big = `1${"0".repeat(308)}`; // 1e308: finite, but two of them overflow a mean
    for (const raw of [huge, big, `-${big}`, "1000000000.5", "1000000001", "-1000000001"]) {
      expect(parseScore(raw, ",")).toMatch(/outside the range of a score/);
    }
    expect(parseScore(huge, ",")).toMatch(/^“1000000000000000000000000000000000000000…”/);
    for (const raw of ["NaN", "Infinity", "-Infinity", "∞", "1e308", "-1e308"])
      expect(typeof parseScore(raw, ",")).toBe("string");
    expect(parseScore("1000000000", ",")).toBe(1e9);
    expect(parseScore("-1000000000,0", ";")).toBe(-1e9);
  });

  it("reads a very long cell in linear time (no backtracking blow-up)", () => {
    const digits = "1".repeat(2_000_000);
    const start = performance.now();
    for (const raw of [digits, `${digits}#`, `${digits}x`, `${digits}.${digits}#`])
      expect(typeof parseScore(raw, ";")).toBe("string");
    // A quadratic pattern takes hours on these; a linear one milliseconds. The bound is loose on purpose.
    expect(performance.now() - start).toBeLessThan(2000);
  });
});
