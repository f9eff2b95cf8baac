import { describe, expect, it } from "vitest";
import { numberOrNull, paddedNumber, parseDecimal } from "@/lib/decimal";
import { isBlock, parseBlock } from "@/lib/sheet/columns";

describe("parseDecimal: what a coach types into a Session sheet cell", () => {
  it("reads decimal points and decimal commas, and empty as an empty trial", () => {
    expect(parseDecimal("41.2")).toEqual({ ok: true, value: 41.2 });
    expect(parseDecimal(" 2,31 ")).toEqual({ ok: true, value: 2.31 });
    expect(parseDecimal(",5")).toEqual({ ok: true, value: 0.5 });
    expect(parseDecimal("-0.3")).toEqual({ ok: true, value: -0.3 });
    expect(parseDecimal("")).toEqual({ ok: true, value: null });
    expect(parseDecimal("   ")).toEqual({ ok: true, value: null });
  });

  it("refuses anything that is not a plain number, with the reason", () => {
    expect(parseDecimal("abc")).toEqual({ ok: false, message: "“abc” is not a number." });
    for (const text of ["1.2.3", "1 480", "4.5 s", "1e3", "NaN", "Infinity", "0x10", "12,3,4"]) {
      expect(parseDecimal(text).ok).toBe(false);
    }
    expect((parseDecimal("4.5 s") as { message: string }).message).toMatch(/unit/);
  });
});

describe("form numbers", () => {
  it("empty is null, text that is not a number is NaN for the schema to refuse", () => {
    expect(numberOrNull("")).toBeNull();
    expect(numberOrNull("0,2")).toBe(0.2);
    expect(numberOrNull(3)).toBe(3);
    expect(Number.isNaN(numberOrNull("two"))).toBe(true);
  });

  it("pads to the test's decimals without rounding what was typed", () => {
    expect(paddedNumber(1.8, 2)).toBe("1.80");
    expect(paddedNumber(1.805, 2)).toBe("1.805");
    expect(paddedNumber(1480, 0)).toBe("1480");
    expect(paddedNumber(null, 2)).toBe("");
  });
});

describe("pasting a block from a spreadsheet", () => {
  it("splits rows by newline (any style) and cells by tab, ignoring the trailing newline", () => {
    expect(parseBlock("1.81\t1.79\r\n1.90\t1,88\n")).toEqual([
      ["1.81", "1.79"],
      ["1.90", "1,88"],
    ]);
    expect(isBlock("41.2\n")).toBe(false);
    expect(isBlock("41.2\t40.8")).toBe(true);
  });
});
