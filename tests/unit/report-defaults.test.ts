import { describe, expect, it } from "vitest";
import type { Phase } from "@/lib/domain";
import { defaultComparison, defaultReliabilityPair } from "@/lib/reports/defaults";

const s = (
  id: number,
  date: string,
  phase: "baseline" | "pre-block" | "post-block" | "retest" | "in-season",
  testIds = [1, 2],
  squadId = 1,
) => ({
  id,
  squadId,
  date,
  phase,
  testIds,
});

describe("defaultComparison", () => {
  it("opens on the latest post-block session against the pre-block before it", () => {
    const sessions = [
      s(1, "2026-08-24", "baseline"),
      s(2, "2026-09-07", "pre-block"),
      s(3, "2026-11-02", "post-block"),
      s(4, "2026-09-01", "retest"),
    ];
    expect(defaultComparison(sessions, 1)).toEqual({ fromSessionId: 2, toSessionId: 3, testId: 1 });
  });

  it("falls back to a baseline, then to the two latest sessions sharing a test", () => {
    expect(defaultComparison([s(1, "2026-08-24", "baseline"), s(3, "2026-11-02", "post-block", [2])], 1)).toEqual({
      fromSessionId: 1,
      toSessionId: 3,
      testId: 2,
    });
    expect(
      defaultComparison([s(5, "2026-01-01", "in-season", [7]), s(6, "2026-02-01", "in-season", [8, 7])], 1),
    ).toEqual({
      fromSessionId: 5,
      toSessionId: 6,
      testId: 7,
    });
  });

  it("is null without two sessions of the squad that share a test", () => {
    expect(
      defaultComparison([s(1, "2026-01-01", "pre-block", [1]), s(2, "2026-02-01", "post-block", [2])], 1),
    ).toBeNull();
    expect(
      defaultComparison([s(1, "2026-01-01", "pre-block"), s(2, "2026-02-01", "post-block", [1], 2)], 1),
    ).toBeNull();
  });
});

describe("defaultReliabilityPair", () => {
  const session = (id: number, squadId: number, date: string, phase: Phase, testIds: number[]) => ({
    id,
    squadId,
    date,
    phase,
    testIds,
  });

  it("opens on the latest retest and the baseline before it that shares a test", () => {
    const sessions = [
      session(1, 1, "2026-08-24", "baseline", [10, 11]),
      session(2, 1, "2026-08-27", "retest", [11, 12]),
      session(3, 1, "2026-09-07", "pre-block", [10, 11]),
      session(4, 2, "2026-01-05", "baseline", [10]),
      session(5, 2, "2026-01-08", "retest", [10]),
    ];
    expect(defaultReliabilityPair(sessions)).toEqual({ firstSessionId: 1, secondSessionId: 2, testId: 11 });
  });

  it("falls back to the latest two sessions of one squad that share a test, else null", () => {
    const sessions = [session(1, 1, "2026-08-24", "pre-block", [10]), session(2, 1, "2026-10-01", "post-block", [10])];
    expect(defaultReliabilityPair(sessions)).toEqual({ firstSessionId: 1, secondSessionId: 2, testId: 10 });
    expect(
      defaultReliabilityPair([
        session(1, 1, "2026-08-24", "baseline", [10]),
        session(2, 2, "2026-08-27", "retest", [10]),
      ]),
    ).toBeNull();
  });
});
