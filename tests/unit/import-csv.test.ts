import { describe, expect, it } from "vitest";
import { detectDelimiter, parseCsv } from "@/lib/import/csv";
import { decodeCsvBytes, ImportFileError } from "@/lib/import/decode";

const bytes = (text: string) => new TextEncoder().encode(text);

describe("decodeCsvBytes", () => {
  it("drops a UTF-8 byte-order mark (EF BB BF, as Excel writes in front of “CSV UTF-8”)", () => {
    const text = decodeCsvBytes(new Uint8Array([0xef, 0xbb, 0xbf, ...bytes("athlete,test\n")]));
    expect(text).toBe("athlete,test\n");
    expect(parseCsv(text).headers).toEqual(["athlete", "test"]);
  });

  it("keeps non-ASCII names intact", () => {
    expect(decodeCsvBytes(bytes("athlete\nTomás Ødegård\n"))).toContain("Tomás Ødegård");
  });

  it("refuses NUL bytes, invalid UTF-8 and UTF-16 with 415, an empty file with 422", () => {
    const cases: [Uint8Array, number, RegExp][] = [
      [new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00]), 415, /binary/],
      [new Uint8Array([0x61, 0x2c, 0xe9, 0x0a]), 415, /not UTF-8/], // "a,é" in Windows-1252
      [new Uint8Array([0xff, 0xfe, 0x61, 0x00]), 415, /UTF-16/],
      [new Uint8Array([]), 422, /empty/],
      [bytes(" \r\n\n"), 422, /empty/],
    ];
    for (const [input, status, message] of cases) {
      try {
        decodeCsvBytes(input);
        expect.unreachable();
      } catch (error) {
        expect(error).toBeInstanceOf(ImportFileError);
        expect((error as ImportFileError).status).toBe(status);
        expect((error as Error).message).toMatch(message);
      }
    }
  });
});

describe("detectDelimiter", () => {
  it("reads the delimiter off the header line, outside quotes", () => {
    expect(detectDelimiter("athlete,test,trial,value\n")).toBe(",");
    expect(detectDelimiter("athlete;test;trial;value\nAna;10 m sprint;1;1,86\n")).toBe(";");
    expect(detectDelimiter("athlete\ttest\tvalue\n")).toBe("\t");
    expect(detectDelimiter('"Surname, first";test;value\n')).toBe(";");
    expect(detectDelimiter("\n\nathlete|test|value\n")).toBe("|");
  });
});

describe("parseCsv", () => {
  it("splits quoted fields the RFC 4180 way: delimiters, doubled quotes and line breaks inside quotes", () => {
    const table = parseCsv(
      'athlete,test,value\n"Silva, Ana","Countermovement ""CMJ"" jump","33.1"\n"Okoro\nBen",10 m sprint,1.9\n',
    );
    expect(table.rows).toEqual([
      ["Silva, Ana", 'Countermovement "CMJ" jump', "33.1"],
      ["Okoro\nBen", "10 m sprint", "1.9"],
    ]);
    expect(table.rowNumbers).toEqual([2, 3]);
  });

  it("handles CRLF line ends (RFC 4180 §2.1) and a missing final line break", () => {
    const table = parseCsv("athlete,test,value\r\nAna,CMJ,1\r\nBen,CMJ,2");
    expect(table.headers).toEqual(["athlete", "test", "value"]);
    expect(table.rows).toEqual([
      ["Ana", "CMJ", "1"],
      ["Ben", "CMJ", "2"],
    ]);
  });

  it("skips blank rows but keeps spreadsheet row numbers", () => {
    const table = parseCsv("\nathlete;value\n\nAna;1,5\n;\nBen;2\n\n");
    expect(table.headerRow).toBe(2);
    expect(table.rows).toEqual([
      ["Ana", "1,5"],
      ["Ben", "2"],
    ]);
    expect(table.rowNumbers).toEqual([4, 6]);
  });

  it("trims headers and reports an unclosed quote by row", () => {
    const table = parseCsv(' athlete , value \nAna,1\nBen,"2\nCat,3\n');
    expect(table.headers).toEqual(["athlete", "value"]);
    expect(table.problems).toHaveLength(1);
    expect(table.problems[0].row).toBe(3);
    expect(table.problems[0].message).toMatch(/RFC 4180/);
  });
});
