import { describe, expect, it } from "vitest";
import { analyseCsv } from "@/lib/import/analyse";
import type { MappingRequest } from "@/lib/import/mapping";
import { context } from "./import-fixtures";

const analyse = (csv: string, request: MappingRequest = {}) => analyseCsv(csv, request, context).plan;
const values = (csv: string, request?: MappingRequest) =>
  analyse(csv, request).groups.flatMap((g) =>
    g.values.flatMap((value, k) => (value === null ? [] : [[g.athleteId, g.testId, k + 1, value, g.rows[k]]])),
  );

describe("long format", () => {
  it("reads athlete by external id or name, test by name, trial and value", () => {
    const csv =
      "athlete,test,trial,value\nNHA001,Countermovement jump,1,33.1\nana silva,countermovement jump,2,34.0\n  Ben Okoro ,10 m sprint,1,1.91\n";
    const plan = analyse(csv);
    expect(plan.errors).toEqual([]);
    expect(plan.format).toBe("long");
    expect(values(csv)).toEqual([
      [11, 1, 1, 33.1, 2],
      [11, 1, 2, 34, 3],
      [12, 2, 1, 1.91, 4],
    ]);
    expect(plan.sample[0]).toMatchObject({
      athleteName: "Ana Silva",
      testName: "Countermovement jump",
      trial: 1,
      value: 33.1,
    });
  });

  it("reads a ; file with decimal commas and a BOM-free CRLF body", () => {
    expect(values("athlete;test;trial;value\r\nNHA002;10 m sprint;1;1,86\r\nNHA002;10 m sprint;2;1,84\r\n")).toEqual([
      [12, 2, 1, 1.86, 2],
      [12, 2, 2, 1.84, 3],
    ]);
  });

  it("skips empty values, and without a trial column every row is trial 1", () => {
    expect(values("athlete,test,value\nNHA001,Back squat 1RM,92.5\nNHA002,Back squat 1RM,\n")).toEqual([
      [11, 5, 1, 92.5, 2],
    ]);
  });

  it("names row and column of every problem, and lists unknown athletes and tests", () => {
    const csv = [
      "athlete,test,trial,value",
      "NHA001,Countermovement jump,1,abc", // 2: bad number
      "Zoe Nobody,Countermovement jump,1,30", // 3: unknown athlete
      "NHA001,Broad jump,1,2.1", // 4: unknown test
      "NHA001,30 m sprint,1,4.5", // 5: in the library, not in the battery
      "NHA001,Countermovement jump,4,30", // 6: trial beyond trialsPerSession
      "NHA001,Countermovement jump,x,30", // 7: trial not a number
      "NHA002,10 m sprint,2,1.9", // 8
      "NHA002,10 m sprint,2,1.8", // 9: duplicate of 8
      "Sam Lee,10 m sprint,1,1.9", // 10: two athletes share the name
      ",10 m sprint,1,1.9", // 11: athlete missing
    ].join("\n");
    const plan = analyse(csv);
    expect(plan.errors.map((e) => [e.row, e.column])).toEqual([
      [2, "value"],
      [3, "athlete"],
      [4, "test"],
      [5, "test"],
      [6, "trial"],
      [7, "trial"],
      [9, "trial"],
      [10, "athlete"],
      [11, "athlete"],
    ]);
    expect(plan.errorCount).toBe(9);
    const byRow = new Map(plan.errors.map((e) => [e.row, e.message]));
    expect(byRow.get(3)).toMatch(/No athlete “Zoe Nobody” on the Academy U18 roster/);
    expect(byRow.get(5)).toMatch(/not in this session's battery/);
    expect(byRow.get(6)).toMatch(/trials 1 to 3/);
    expect(byRow.get(9)).toMatch(/Rows 8 and 9 both give 10 m sprint trial 2 for Ben Okoro/);
    expect(byRow.get(10)).toMatch(/external id/);
    expect(plan.unknownAthletes).toEqual([
      { value: "Zoe Nobody", reason: "unknown", count: 1, rows: [3], suggestions: [] },
      { value: "Sam Lee", reason: "ambiguous", count: 1, rows: [10] },
    ]);
    expect(plan.unknownTests.map((t) => [t.name, t.reason, t.rows])).toEqual([
      ["Broad jump", "unknown", [4]],
      ["30 m sprint", "not-in-battery", [5]],
    ]);
  });

  it("warns (without blocking) about implausible values, e.g. a sprint typed in hundredths", () => {
    const plan = analyse("athlete,test,trial,value\nNHA001,10 m sprint,1,186\n");
    expect(plan.errors).toEqual([]);
    expect(plan.warnings[0]).toMatchObject({ row: 2, column: "trial" });
    expect(plan.warnings[0].message).toMatch(/plausible range/);
  });

  it("caps the listed errors but counts them all", () => {
    const rows = Array.from({ length: 500 }, (_, i) => `Nobody ${i},Countermovement jump,1,30`);
    const plan = analyse(["athlete,test,trial,value", ...rows].join("\n"));
    expect(plan.errorCount).toBe(500);
    expect(plan.errors).toHaveLength(200);
    expect(plan.unknownAthletes).toHaveLength(200);
    expect(plan.unknownAthleteCount).toBe(500);
  });

  it("a row cut short (another delimiter than the header's) is an error, not an empty score", () => {
    const plan = analyse("athlete,test,trial,value\nNHA001;Countermovement jump;1;33.1\n");
    expect(plan.errors).toEqual([{ row: 2, message: expect.stringMatching(/1 cell but the header has 4 columns/) }]);
  });
});

describe("wide format", () => {
  it("reads one column per test-trial; a plain test-name column is trial 1", () => {
    const csv =
      "athlete,Countermovement jump 1,Countermovement jump #2,Countermovement jump (trial 3),10 m sprint,Position\nNHA001,33.1,,34.2,1.88,Winger\nBen Okoro,,,,1.95,\n";
    const plan = analyse(csv);
    expect(plan.errors).toEqual([]);
    expect(plan.format).toBe("wide");
    expect(values(csv)).toEqual([
      [11, 1, 1, 33.1, 2],
      [11, 1, 3, 34.2, 2],
      [11, 2, 1, 1.88, 2],
      [12, 2, 1, 1.95, 3],
    ]);
  });

  it("uses the mapping chosen in the UI, ignoring columns it leaves out", () => {
    const csv = "Player;CMJ-a;CMJ-b;Notes\nNHA002;31,5;32,0;tired\n";
    const request: MappingRequest = {
      format: "wide",
      athleteColumn: "Player",
      columns: { "CMJ-a": { testId: 1, trial: 1 }, "CMJ-b": { testId: 1, trial: 2 } },
    };
    expect(values(csv, request)).toEqual([
      [12, 1, 1, 31.5, 2],
      [12, 1, 2, 32, 2],
    ]);
  });

  it("names row and column of bad cells; an unknown athlete is one error on the athlete column", () => {
    const csv = "athlete,Countermovement jump 1,10 m sprint\nNHA001,33.1,fast\nNobody,30,1.9\nNHA001,34,\n";
    const plan = analyse(csv);
    expect(plan.errors.map((e) => [e.row, e.column])).toEqual([
      [2, "10 m sprint"],
      [3, "athlete"],
      [4, "Countermovement jump 1"],
    ]);
    expect(plan.errors[2].message).toMatch(/Rows 2 and 4 both give Countermovement jump trial 1 for Ana Silva/);
  });

  it("flags a row wider than the header (a decimal comma in a comma-separated file)", () => {
    const plan = analyse("athlete,10 m sprint\nNHA001,1,86\n");
    expect(plan.errors[0]).toMatchObject({ row: 2 });
    expect(plan.errors[0].message).toMatch(/3 cells but the header has 2/);
  });

  it("a header-only file says there are no data rows", () => {
    const plan = analyse("athlete,Countermovement jump 1\n");
    expect(plan.errors).toEqual([{ row: 2, message: "There are no data rows below the header." }]);
  });
});
