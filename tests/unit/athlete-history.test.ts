/**
 * Athlete history's pairing of consecutive scores (lib/reports/athlete-history.ts). Expected
 * intervals are written out here: change ± z·√2·TE with z from jStat (TE entered without df).
 */
import jstatPkg from "jstat";
import { describe, expect, it } from "vitest";
import { type HistoryScore, type HistoryTest, historyOfTest } from "@/lib/reports/athlete-history";

const jStat = (jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg;

const score = (sessionId: number, value: number | null, flag: HistoryScore["flag"] = null): HistoryScore => ({
  resultId: sessionId,
  sessionId,
  date: `2026-0${sessionId}-01`,
  phase: "retest",
  status: "published",
  squadName: "Squad",
  value,
  flag,
});

const sprint: HistoryTest = {
  id: 1,
  name: "20 m sprint",
  unit: "s",
  decimals: 2,
  direction: "lower",
  swcMethod: "cv-factor",
  swcValue: 0.3,
  cvPercent: 1,
  typicalError: 0.03,
  typicalErrorDf: null,
  scores: [score(1, 3.2), score(2, null, "injured"), score(3, 3.1), score(4, 3.12)],
};

describe("historyOfTest", () => {
  it("skips flagged scores and reads each change against 0.3 × CV% of the previous score", () => {
    const h = historyOfTest(sprint, 0.9);
    expect(h.swcBasis).toBe("cv");
    expect(h.scores.map((s) => s.previousSessionId)).toEqual([null, null, 1, 3]);
    const z = jStat.normal.inv(0.95, 0, 1);
    const third = h.scores[2];
    expect(third.change).toBeCloseTo(-0.1, 12);
    expect(third.swc).toBeCloseTo((0.3 * 1 * 3.2) / 100, 12);
    expect(Math.abs(third.ciLower! - (-0.1 - z * Math.SQRT2 * 0.03))).toBeLessThan(1e-9);
    expect(Math.abs(third.ciUpper! - (-0.1 + z * Math.SQRT2 * 0.03))).toBeLessThan(1e-9);
    // Faster by 0.1 s with the whole interval beyond the 0.0096 s SWC: a clear gain for a sprint.
    expect(third.verdict).toBe("clear-gain");
    expect(third.betterChange).toBeCloseTo(0.1, 12);
    // 0.02 s slower, interval about −0.09 to +0.05 s once turned so that better is positive: crosses 0 and leaves the band.
    expect(h.scores[3].verdict).toBe("inconclusive");
  });

  it("gives changes without verdicts when the SWC needs a squad or the TE is missing", () => {
    const squad = historyOfTest({ ...sprint, swcMethod: "sd-factor", swcValue: 0.2 }, 0.9);
    expect(squad.swcBasis).toBe("needs-squad");
    expect(squad.scores[2].change).toBeCloseTo(-0.1, 12);
    expect(squad.scores.every((s) => s.verdict === null && s.ciLower === null)).toBe(true);
    const noTe = historyOfTest({ ...sprint, typicalError: null }, 0.9);
    expect(noTe.swcBasis).toBe("no-te");
    expect(noTe.scores.every((s) => s.verdict === null)).toBe(true);
    expect(historyOfTest({ ...sprint, cvPercent: null }, 0.9).swcBasis).toBe("no-cv");
  });
});
