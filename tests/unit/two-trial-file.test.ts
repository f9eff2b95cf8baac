import { describe, expect, it } from "vitest";
import { asReportRow, MAX_TWO_TRIAL_ROWS, readTwoTrialFile, TwoTrialFileError } from "@/lib/reports/two-trial-file";

const refusal = (text: string) => {
  try {
    readTwoTrialFile(text);
  } catch (error) {
    if (error instanceof TwoTrialFileError) return error;
    throw error;
  }
  throw new Error("expected the file to be refused");
};

describe("readTwoTrialFile", () => {
  it("reads athlete, first and second trial under a header, with spreadsheet row numbers", () => {
    const { rows } = readTwoTrialFile("athlete,day 1,day 2\nAva Lind,31.2,30.8\n\nBea Holm,28.4,29\n");
    expect(rows).toEqual([
      { row: 2, label: "Ava Lind", first: 31.2, second: 30.8 },
      { row: 4, label: "Bea Holm", first: 28.4, second: 29 },
    ]);
  });

  it("reads a decimal comma in a semicolon file, as a spreadsheet in such a locale saves it", () => {
    expect(readTwoTrialFile("athlete;day 1;day 2\nAva;31,2;30,8").rows[0]).toMatchObject({ first: 31.2, second: 30.8 });
  });

  it("reads two columns pasted from a spreadsheet without a header, naming rows by number", () => {
    const { rows } = readTwoTrialFile("1.91\t1.93\n1.85\t1.82\n");
    expect(rows).toEqual([
      { row: 1, label: "Row 1", first: 1.91, second: 1.93 },
      { row: 2, label: "Row 2", first: 1.85, second: 1.82 },
    ]);
  });

  it("treats a first line of numbers as data, not as a header", () => {
    expect(readTwoTrialFile("Ava,31.2,30.8\nBea,28.4,29.0").rows.map((r) => r.label)).toEqual(["Ava", "Bea"]);
  });

  it("keeps a row with one score, so the report can list it as left out, and skips a row with none", () => {
    const { rows } = readTwoTrialFile("athlete,t1,t2\nAva,31.2,\nBea,,\nCleo,,29.1");
    expect(rows.map((r) => [r.label, r.first, r.second])).toEqual([
      ["Ava", 31.2, null],
      ["Cleo", null, 29.1],
    ]);
  });

  it("names every cell that is not a number by row and column, and stores nothing of the file", () => {
    const error = refusal("athlete,day 1,day 2\nAva,31.2,30.8\nBea,28.4 cm,29\nCleo,abc,30");
    expect(error.message).toBe("2 scores are not numbers.");
    expect(error.rows).toEqual([
      { row: 3, column: "day 1", message: expect.stringContaining("has a unit") },
      { row: 4, column: "day 1", message: "“abc” is not a number." },
    ]);
  });

  it("refuses an ambiguous comma in a comma-separated file rather than guess", () => {
    expect(refusal('a,b,c\nAva,"31,2",30.8').rows[0]).toMatchObject({ row: 2, column: "b" });
  });

  it("refuses a file that does not have two or three columns, saying what it needs", () => {
    expect(refusal("athlete,t1,t2,t3\nAva,1,2,3").message).toMatch(/three columns .* or two .*; this one has 4/);
    expect(refusal("just one column\n12").message).toMatch(/this one has 1/);
  });

  it("refuses an empty file and a file without scores", () => {
    expect(refusal("").message).toBe("The file is empty.");
    expect(refusal("athlete,t1,t2\nAva,,\n").message).toBe("The file holds no scores.");
  });

  it("refuses more rows than a retest study could have", () => {
    const text = Array.from({ length: MAX_TWO_TRIAL_ROWS + 1 }, (_, i) => `${i},1,2`).join("\n");
    expect(refusal(text).message).toMatch(/at most 2000/);
  });

  it("turns a row into a report row: first trial as pre, second as post, the row number as its key", () => {
    expect(asReportRow({ row: 7, label: "Ava", first: 1.9, second: null })).toEqual({
      athleteId: 7,
      name: "Ava",
      pre: { value: 1.9, flag: null },
      post: null,
    });
  });
});
