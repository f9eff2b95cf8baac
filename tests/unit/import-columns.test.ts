import { describe, expect, it } from "vitest";
import { detectFormat, parseTrialHeader, suggestWideColumns } from "@/lib/import/columns";
import { parseCsv } from "@/lib/import/csv";
import { resolveMapping } from "@/lib/import/mapping";
import { context } from "./import-fixtures";

describe("detectFormat", () => {
  it("long when a column is headed test, wide otherwise", () => {
    expect(detectFormat(["athlete", "test", "trial", "value"])).toBe("long");
    expect(detectFormat(["Athlete ID", "Test", "Score"])).toBe("long");
    expect(detectFormat(["athlete", "Countermovement jump 1", "10 m sprint"])).toBe("wide");
    expect(detectFormat(["foo", "bar"])).toBe("wide");
  });
});

describe("parseTrialHeader", () => {
  it("reads the trial number in the common spellings", () => {
    expect(parseTrialHeader("Countermovement jump 2")).toEqual({ name: "Countermovement jump", trial: 2 });
    expect(parseTrialHeader("Countermovement jump #2")).toEqual({ name: "Countermovement jump", trial: 2 });
    expect(parseTrialHeader("Countermovement jump (trial 2)")).toEqual({ name: "Countermovement jump", trial: 2 });
    expect(parseTrialHeader("Countermovement jump - trial 3")).toEqual({ name: "Countermovement jump", trial: 3 });
    expect(parseTrialHeader("Countermovement jump T1")).toEqual({ name: "Countermovement jump", trial: 1 });
    expect(parseTrialHeader("10 m sprint [2]")).toEqual({ name: "10 m sprint", trial: 2 });
    expect(parseTrialHeader("10 m sprint_3")).toEqual({ name: "10 m sprint", trial: 3 });
  });

  it("leaves headers without a trial number alone", () => {
    expect(parseTrialHeader("10 m sprint")).toBeNull();
    expect(parseTrialHeader("Back squat 1RM")).toBeNull();
    expect(parseTrialHeader("Intermittent recovery run (level 1)")).toBeNull();
  });
});

describe("suggestWideColumns", () => {
  it("matches whole names first, then name + trial, case-insensitively, with a unit suffix allowed", () => {
    const headers = [
      "Athlete",
      "countermovement jump 1",
      "Countermovement jump (cm) #2",
      "10 M SPRINT",
      "Intermittent recovery run (level 1)",
      "Back squat 1RM",
      "Position",
      "30 m sprint 1",
      "Broad jump",
    ];
    const s = suggestWideColumns(headers, context, "Athlete");
    expect(s.map((c) => [c.header, c.status, c.testId, c.trial])).toEqual([
      ["Athlete", "athlete", null, null],
      ["countermovement jump 1", "matched", 1, 1],
      ["Countermovement jump (cm) #2", "matched", 1, 2],
      ["10 M SPRINT", "matched", 2, 1],
      ["Intermittent recovery run (level 1)", "matched", 4, 1],
      ["Back squat 1RM", "matched", 5, 1],
      ["Position", "ignored", null, null],
      ["30 m sprint 1", "not-in-battery", null, null],
      ["Broad jump", "unknown", null, null],
    ]);
  });
});

describe("resolveMapping (header errors land on the header row)", () => {
  const resolve = (csv: string, request = {}) => resolveMapping(parseCsv(csv), request, context);

  it("suggests long columns", () => {
    const r = resolve("Athlete,Test,Trial,Value\n");
    expect(r.mapping).toEqual({
      format: "long",
      columns: { athlete: "Athlete", test: "Test", trial: "Trial", value: "Value" },
    });
    expect(r.errors).toEqual([]);
  });

  it("lists unknown and not-in-battery wide columns as row 1 errors", () => {
    const r = resolve("athlete,Countermovement jump 1,Broad jump,30 m sprint\n");
    expect(r.errors.map((e) => [e.row, e.column])).toEqual([
      [1, "Broad jump"],
      [1, "30 m sprint"],
    ]);
    expect(r.errors[1].message).toMatch(/not in this session's battery/);
    expect(r.unknownTests.map((t) => [t.name, t.reason])).toEqual([
      ["Broad jump", "unknown"],
      ["30 m sprint", "not-in-battery"],
    ]);
  });

  it("an explicit mapping is authoritative: unnamed columns are ignored, wrong targets refused", () => {
    const ok = resolve("athlete,Broad jump,CMJ a,CMJ b\n", {
      columns: { "CMJ a": { testId: 1, trial: 1 }, "CMJ b": { testId: 1, trial: 2 }, "Broad jump": null },
    });
    expect(ok.errors).toEqual([]);
    expect(ok.mapping).toMatchObject({
      format: "wide",
      athleteColumn: "athlete",
      columns: { "CMJ a": { testId: 1, trial: 1 }, "CMJ b": { testId: 1, trial: 2 } },
    });

    const bad = resolve("athlete,a,b,c\n", {
      columns: { a: { testId: 1, trial: 1 }, b: { testId: 1, trial: 1 }, c: { testId: 99, trial: 1 }, d: null },
    });
    expect(bad.errors.map((e) => e.column)).toEqual(["b", "c", "d"]);
    expect(bad.errors[0].message).toMatch(/both mapped/);
    const trialTooHigh = resolve("athlete,a\n", { columns: { a: { testId: 5, trial: 2 } } });
    expect(trialTooHigh.errors[0].message).toMatch(/trials 1 to 1/);
  });

  it("reports a header of one column, duplicate headers and a missing athlete column", () => {
    expect(resolve("athlete test value\n").errors[0].message).toMatch(/only one column/);
    const dup = resolve("athlete,10 m sprint,10 m sprint\n").errors;
    expect(dup[0]).toMatchObject({ row: 1, column: "10 m sprint" });
    expect(dup[0].message).toMatch(/Columns 2 and 3/);
    expect(resolve("who,Countermovement jump\n").errors[0].message).toMatch(/No column names the athlete/);
    expect(resolve("athlete,test,trial\n").errors[0].message).toMatch(/No column holds the score/);
  });
});
