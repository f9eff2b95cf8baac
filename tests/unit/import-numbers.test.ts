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
