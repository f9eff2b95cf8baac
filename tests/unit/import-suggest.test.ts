import { describe, expect, it } from "vitest";
import { editDistance, foldName, suggestNames } from "@/lib/import/suggest";

const roster = ["Luca Dempsey", "Theo Varga", "Clío Nakashima", "Sami Okonkwo", "Eli Mbeki-Novak"];

describe("editDistance", () => {
  it("counts insertions, deletions and substitutions (Levenshtein's classic kitten → sitting is 3)", () => {
    // The kitten/sitting example is common practice in texts on edit distance.
    expect(editDistance("kitten", "sitting")).toBe(3);
    expect(editDistance("", "abc")).toBe(3);
    expect(editDistance("dempsy", "dempsey")).toBe(1);
    expect(editDistance("same", "same")).toBe(0);
  });
});

describe("suggestNames", () => {
  it("offers the roster name for a misspelling, other accents or case, initials and swapped names", () => {
    expect(suggestNames("Luca Dempsy", roster)).toEqual(["Luca Dempsey"]);
    expect(suggestNames("clio nakashima", roster)).toEqual(["Clío Nakashima"]);
    expect(suggestNames("L. Dempsey", roster)).toEqual(["Luca Dempsey"]);
    expect(suggestNames("Varga Theo", roster)).toEqual(["Theo Varga"]);
    expect(suggestNames("Eli Mbeki Novak", roster)).toEqual(["Eli Mbeki-Novak"]);
  });

  it("offers nothing for a name that is not close, or an empty one", () => {
    expect(suggestNames("Jordan Smith", roster)).toEqual([]);
    expect(suggestNames("  ", roster)).toEqual([]);
    expect(suggestNames("Theo", roster)).toEqual([]);
  });

  it("offers test names too, and folds punctuation", () => {
    expect(suggestNames("10m sprint", ["10 m sprint", "30 m sprint"])).toEqual(["10 m sprint"]);
    expect(suggestNames("Countermovment jump", ["Countermovement jump"])).toEqual(["Countermovement jump"]);
    // Words in another order, with a slip: a timing-gate export's "Sprnt 10 m".
    expect(suggestNames("Sprnt 10 m", ["10 m sprint", "30 m sprint"])).toEqual(["10 m sprint"]);
    expect(foldName("Clío  O'Neil")).toBe("clio o neil");
  });
});

describe("suggestNames for short forms", () => {
  // Common practice: coaches write a test by its initials ("CMJ" for the countermovement jump).
  it("offers a test whose words a short form abbreviates, in order", () => {
    const battery = ["Countermovement jump", "10 m sprint", "Back squat 1RM", "Squat jump"];
    expect(suggestNames("CMJ", battery)).toEqual(["Countermovement jump"]);
    expect(suggestNames("SJ", battery)).toEqual(["Squat jump"]);
  });

  it("offers nothing when the letters are out of order, or the numbers differ", () => {
    expect(suggestNames("JMC", ["Countermovement jump"])).toEqual([]);
    expect(suggestNames("BS", ["Back squat 1RM"])).toEqual([]);
    expect(suggestNames("C", ["Countermovement jump"])).toEqual([]);
  });
});
