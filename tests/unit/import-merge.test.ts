import { describe, expect, it } from "vitest";
import { planWrites, resultKey } from "@/lib/import/merge";
import type { ExistingResult, ImportGroup } from "@/lib/import/types";

const tests = new Map([
  [1, { trialRule: "best" as const, direction: "higher" as const }],
  [2, { trialRule: "best" as const, direction: "lower" as const }],
  [3, { trialRule: "mean" as const, direction: "higher" as const }],
]);
/** A group from (trial, value, row) triples, laid out as the plan lays it out. */
function group(athleteId: number, testId: number, cells: [number, number, number?][]): ImportGroup {
  const values: (number | null)[] = [];
  const rows: number[] = [];
  for (const [trial, value, row = 2] of cells) {
    while (values.length < trial) {
      values.push(null);
      rows.push(0);
    }
    values[trial - 1] = value;
    rows[trial - 1] = row;
  }
  return { athleteId, testId, values, rows };
}
const column = () => "value";

describe("planWrites", () => {
  it("creates new results with trials in place and the value reduced by the test's rule and direction", () => {
    const groups: ImportGroup[] = [
      group(1, 1, [
        [1, 30],
        [3, 32],
      ]),
      group(1, 2, [
        [1, 1.9],
        [2, 1.85],
      ]),
      group(1, 3, [
        [1, 10],
        [2, 12],
      ]),
    ];
    const plan = planWrites(groups, new Map(), tests);
    expect(plan.writes.map((w) => [w.testId, w.trials, w.value, w.isNew])).toEqual([
      [1, [30, null, 32], 32, true],
      [2, [1.9, 1.85], 1.85, true],
      [3, [10, 12], 11, true],
    ]);
    expect(plan.counts).toEqual({
      values: 6,
      resultsCreated: 3,
      resultsUpdated: 0,
      resultsUnchanged: 0,
      trialsReplaced: 0,
    });
  });

  it("fills empty slots of a stored result without calling it a replacement; overwriting a value is one", () => {
    const existing = new Map<string, ExistingResult>([
      [resultKey(1, 1), { trials: [30, null], flag: null, version: 4 }],
    ]);
    const fill = planWrites([group(1, 1, [[2, 31]])], existing, tests, column);
    expect(fill.replacements).toEqual([]);
    expect(fill.writes[0]).toMatchObject({ trials: [30, 31], value: 31, isNew: false });

    const over = planWrites([group(1, 1, [[1, 29, 7]])], existing, tests, column);
    expect(over.replacements).toEqual([
      { athleteId: 1, testId: 1, trial: 1, previous: 30, previousFlag: null, next: 29, row: 7, column: "value" },
    ]);
    expect(over.writes[0].trials).toEqual([29]); // trailing empty slot dropped, as the Session sheet stores it
    expect(over.counts.trialsReplaced).toBe(1);
  });

  it("the same values again change nothing (re-importing a file is harmless)", () => {
    const existing = new Map<string, ExistingResult>([[resultKey(1, 1), { trials: [30, 31], flag: null, version: 2 }]]);
    const plan = planWrites(
      [
        group(1, 1, [
          [1, 30],
          [2, 31],
        ]),
      ],
      existing,
      tests,
      column,
    );
    expect(plan.writes).toEqual([]);
    expect(plan.counts).toMatchObject({ resultsUnchanged: 1, resultsUpdated: 0, trialsReplaced: 0 });
  });

  it("scores for a result flagged absent/injured would clear the flag, so they count as a replacement", () => {
    const existing = new Map<string, ExistingResult>([[resultKey(1, 1), { trials: [], flag: "injured", version: 1 }]]);
    const plan = planWrites([group(1, 1, [[1, 30]])], existing, tests, column);
    expect(plan.replacements[0]).toMatchObject({ trial: null, previousFlag: "injured" });
  });
});
