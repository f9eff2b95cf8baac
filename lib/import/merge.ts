/**
 * Merges the file's trial values into what the session already holds. A stored value is only
 * overwritten when the caller said so (replace=yes); the same value again is no change at all.
 */
import { reduceTrials } from "@/lib/trials";
import type { ColumnOf, ExistingResult, ImportCounts, ImportGroup, ImportTest } from "./types";

export type ResultWrite = {
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  value: number | null;
  isNew: boolean;
};

/** A stored trial value (or a flag such as "absent") the import would overwrite. */
export type Replacement = {
  athleteId: number;
  testId: number;
  trial: number | null;
  previous: number | null;
  previousFlag: string | null;
  next: number | null;
  row: number;
  column: string;
};

export type WritePlan = { writes: ResultWrite[]; replacements: Replacement[]; counts: ImportCounts };

export const resultKey = (athleteId: number, testId: number) => `${athleteId}:${testId}`;

export function planWrites(
  groups: ImportGroup[],
  existing: Map<string, ExistingResult>,
  testsById: Map<number, Pick<ImportTest, "trialRule" | "direction">>,
  columnOf: ColumnOf = () => "",
): WritePlan {
  const writes: ResultWrite[] = [];
  const replacements: Replacement[] = [];
  let values = 0;
  let created = 0;
  let updated = 0;
  let unchanged = 0;
  for (const group of groups) {
    const test = testsById.get(group.testId)!;
    const stored = existing.size ? existing.get(resultKey(group.athleteId, group.testId)) : undefined;
    let count = 0;
    for (const v of group.values) if (v !== null) count++;
    values += count;
    if (!stored) {
      // The file's own array is the result: trial k + 1 at index k, holes null, nothing trailing.
      created++;
      writes.push({
        athleteId: group.athleteId,
        testId: group.testId,
        trials: group.values,
        value: reduceTrials(group.values, test.trialRule, test.direction),
        isNew: true,
      });
      continue;
    }
    const trials: (number | null)[] = [...stored.trials];
    let changed = false;
    if (stored.flag) {
      // A flag says the athlete was absent, injured or the attempt invalid: scores contradict it.
      const k = group.values.findIndex((v) => v !== null);
      replacements.push({
        athleteId: group.athleteId,
        testId: group.testId,
        trial: null,
        previous: null,
        previousFlag: stored.flag,
        next: null,
        row: group.rows[k],
        column: columnOf(group.testId, k + 1),
      });
      changed = true;
    }
    group.values.forEach((value, k) => {
      if (value === null) return;
      while (trials.length <= k) trials.push(null);
      const previous = trials[k] ?? null;
      if (previous === value) return;
      if (previous !== null) {
        replacements.push({
          athleteId: group.athleteId,
          testId: group.testId,
          trial: k + 1,
          previous,
          previousFlag: null,
          next: value,
          row: group.rows[k],
          column: columnOf(group.testId, k + 1),
        });
      }
      trials[k] = value;
      changed = true;
    });
    if (!changed) {
      unchanged++;
      continue;
    }
    updated++;
    // Trailing empty slots carry nothing (the Session sheet stores trials the same way).
    while (trials.length > 0 && trials[trials.length - 1] === null) trials.pop();
    writes.push({
      athleteId: group.athleteId,
      testId: group.testId,
      trials,
      value: reduceTrials(trials, test.trialRule, test.direction),
      isNew: false,
    });
  }
  return {
    writes,
    replacements,
    counts: {
      values,
      resultsCreated: created,
      resultsUpdated: updated,
      resultsUnchanged: unchanged,
      trialsReplaced: replacements.length,
    },
  };
}
