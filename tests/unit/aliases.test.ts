import { describe, expect, it } from "vitest";
import { aliasClash, cleanAliases } from "@/lib/aliases";
import { analyseCsv } from "@/lib/import/analyse";
import { type MappingDraft, withTestMatch } from "@/lib/import/mapping-draft";
import { applyMatches } from "@/lib/import/matches";
import { context } from "./import-fixtures";

describe("cleanAliases", () => {
  it("trims, drops blanks, repeats (any case) and the owner's own name, keeping the order", () => {
    expect(
      cleanAliases([" CMJ ", "cmj", "", "Countermovement  jump", "Counter movement jump"], "Countermovement jump"),
    ).toEqual(["CMJ", "Counter movement jump"]);
  });
});

describe("aliasClash", () => {
  const library = [
    { id: 1, name: "Countermovement jump", aliases: ["CMJ"] },
    { id: 2, name: "Squat jump", aliases: [] },
  ];
  it("finds a name that already reads as another test, by name or by alias", () => {
    expect(aliasClash(["cmj"], 2, library)).toEqual({ name: "cmj", owner: "Countermovement jump" });
    expect(aliasClash(["SQUAT JUMP"], 1, library)).toEqual({ name: "SQUAT JUMP", owner: "Squat jump" });
  });
  it("lets a test keep its own names", () => {
    expect(aliasClash(["CMJ", "Jump"], 1, library)).toBeNull();
  });
});

describe("aliases in the Import", () => {
  const withCmj = {
    ...context,
    tests: context.tests.map((t) => (t.id === 1 ? { ...t, aliases: ["CMJ"] } : t)),
  };

  it("reads a test's other name in a long file, and with a trial in a wide header", () => {
    const long = analyseCsv("athlete,test,trial,value\nAna Silva,cmj,1,35.5\n", {}, withCmj).plan;
    expect(long.errorCount).toBe(0);
    expect(long.groups).toEqual([{ athleteId: 11, testId: 1, values: [35.5], rows: [2] }]);
    const wide = analyseCsv("athlete,CMJ 1,CMJ (cm) 2\nAna Silva,35.5,36.1\n", {}, withCmj).plan;
    expect(wide.errorCount).toBe(0);
    expect(wide.groups).toEqual([{ athleteId: 11, testId: 1, values: [35.5, 36.1], rows: [2, 2] }]);
  });

  it("a mapping that names some columns leaves the others to be read as their headers say, or reported", () => {
    const mapping = { format: "wide" as const, columns: { "Jump A": { testId: 1, trial: 1 } } };
    const read = analyseCsv("athlete,Jump A,CMJ 2\nAna Silva,35,36\n", mapping, withCmj).plan;
    expect(read.errorCount).toBe(0);
    expect(read.groups).toEqual([{ athleteId: 11, testId: 1, values: [35, 36], rows: [2, 2] }]);
    const unread = analyseCsv("athlete,Jump A,Dash 1\nAna Silva,35,1.8\n", mapping, withCmj).plan;
    expect(unread.errors.map((e) => e.column)).toEqual(["Dash 1"]);
    expect(unread.unknownTests.map((t) => t.name)).toEqual(["Dash"]);
    const ignored = analyseCsv(
      "athlete,Jump A,Dash 1\nAna Silva,35,1.8\n",
      { ...mapping, columns: { ...mapping.columns, "Dash 1": null } },
      withCmj,
    ).plan;
    expect(ignored.errorCount).toBe(0);
  });

  it("lists an unknown wide test once, by the name the file uses, with what it may be", () => {
    const { plan } = analyseCsv("athlete,CMJ 1,CMJ 2\nAna Silva,35.5,36.1\n", {}, context);
    expect(plan.unknownTests).toEqual([
      {
        name: "CMJ",
        reason: "unknown",
        count: 2,
        rows: [1],
        column: "CMJ 1",
        suggestions: [{ id: 1, name: "Countermovement jump" }],
      },
    ]);
  });

  it("a match made in this import reads the name as that athlete, and settles a name two athletes share", () => {
    const text = "athlete,test,trial,value\nAna Silvaa,10 m sprint,1,1.81\nSam Lee,10 m sprint,1,1.92\n";
    const before = analyseCsv(text, {}, context).plan;
    expect(before.unknownAthletes.map((a) => [a.value, a.reason, a.suggestions])).toEqual([
      ["Ana Silvaa", "unknown", [{ id: 11, name: "Ana Silva" }]],
      ["Sam Lee", "ambiguous", undefined],
    ]);
    const matched = applyMatches(context, { athletes: { "Ana Silvaa": 11, "Sam Lee": 14 }, tests: {} });
    expect(matched.problems).toEqual([]);
    const after = analyseCsv(text, {}, matched.context).plan;
    expect(after.errorCount).toBe(0);
    expect(after.groups.map((g) => g.athleteId)).toEqual([11, 14]);
  });

  it("refuses a match to an athlete off the roster or a test outside the battery", () => {
    const { problems } = applyMatches(context, { athletes: { Ghost: 99 }, tests: { Jump: 3 } });
    expect(problems).toEqual([
      "“Ghost” is matched to an athlete who is not on the Academy U18 roster.",
      "“Jump” is matched to a test that is not in this battery.",
    ]);
  });
});

describe("withTestMatch", () => {
  it("points every column of the matched name at the test, at its header's trial, and back to unread on undo", () => {
    const draft: MappingDraft = {
      format: "wide" as const,
      athleteColumn: "Athlete",
      columns: {
        "CMJ 1": { testId: 1, trial: 1 },
        "Sprnt 10 m 1": "unread",
        "Sprnt 10 m (trial 2)": "unread",
        Notes: null,
      },
    };
    const headers = ["Athlete", "CMJ 1", "Sprnt 10 m 1", "Sprnt 10 m (trial 2)", "Notes"];
    const matched = withTestMatch(draft, headers, "sprnt 10 m", 2);
    expect(matched).toEqual({
      ...draft,
      columns: {
        "CMJ 1": { testId: 1, trial: 1 },
        "Sprnt 10 m 1": { testId: 2, trial: 1 },
        "Sprnt 10 m (trial 2)": { testId: 2, trial: 2 },
        Notes: null,
      },
    });
    expect(withTestMatch(matched, headers, "Sprnt 10 m", null)).toEqual(draft);
  });
});

describe("leaving rows out", () => {
  it("skips the rows of a name asked to be left out, counts them, and lists no problem for them", () => {
    const text =
      "athlete,test,trial,value\nAna Silva,10 m sprint,1,1.81\nGuest Runner,10 m sprint,1,1.95\nAna Silva,30 m sprint,1,4.4\nAna Silva,30 m sprint,2,4.38\n";
    const before = analyseCsv(text, {}, context).plan;
    expect(before.errorCount).toBe(3);
    const { context: asked } = applyMatches(context, {
      athletes: {},
      tests: {},
      leaveOut: { athletes: ["guest runner"], tests: ["30 M SPRINT"] },
    });
    const after = analyseCsv(text, {}, asked).plan;
    expect(after.errorCount).toBe(0);
    expect(after.valueCount).toBe(1);
    expect(after.leftOut).toEqual([
      { kind: "athlete", name: "Guest Runner", rows: 1 },
      { kind: "test", name: "30 m sprint", rows: 2 },
    ]);
  });
});
