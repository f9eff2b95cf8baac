/**
 * The Reliability check's composition (lib/reports/reliability-report.ts) on Weir (2005) dataset A,
 * whose figures METHODS.md §3.6 lists (computed, with Weir's own SEM 7.6 as published).
 */
import { describe, expect, it } from "vitest";
import { buildReliabilityReport, kooLiBand } from "@/lib/reports/reliability-report";
import { StatsInputError } from "@/lib/stats";
import { explainIcc, KOO_LI_LABELS } from "@/lib/words/reliability";

const trial1 = [146, 148, 170, 90, 157, 156, 176, 205];
const trial2 = [140, 152, 152, 99, 145, 153, 167, 218];
const score = (value: number) => ({ value, flag: null });
const rows = trial1.map((v, i) => ({ athleteId: i + 1, name: `A${i + 1}`, pre: score(v), post: score(trial2[i]) }));
const test = { swcMethod: "sd-factor" as const, swcValue: 0.2, cvPercent: null };

describe("buildReliabilityReport", () => {
  it("reproduces Weir (2005) dataset A (METHODS.md §3.6)", () => {
    const r = buildReliabilityReport({ test, rows, confidence: 0.95 });
    expect(r.n).toBe(8);
    expect(r.df).toBe(7);
    expect(r.typicalError).toBeCloseTo(7.55693, 4); // Weir: SEM 7.6
    expect(r.typicalErrorLower).toBeCloseTo(4.9964, 3);
    expect(r.typicalErrorUpper).toBeCloseTo(15.3804, 3);
    expect(r.cvPercent).toBeCloseTo(5.1616, 3);
    expect(r.changeInMean).toBeCloseTo(-2.75, 10);
    expect(r.changeLower).toBeCloseTo(-11.6847, 3);
    expect(r.changeUpper).toBeCloseTo(6.1846, 3);
    expect(r.icc31).toBeCloseTo(0.947, 3);
    expect(r.icc31Lower).toBeCloseTo(0.7607, 3);
    expect(r.icc31Upper).toBeCloseTo(0.9892, 3);
    expect(r.icc21).toBeCloseTo(0.95, 3);
    expect(r.icc21Lower).toBeCloseTo(0.787, 3);
    expect(r.icc21Upper).toBeCloseTo(0.9896, 3);
    expect(r.iccReading).toBe("excellent");
    expect(r.limitsOfAgreement.lower).toBeCloseTo(-23.697, 2);
    expect(r.limitsOfAgreement.upper).toBeCloseTo(18.197, 2);
    // SWC 0.2 × SD of the first session (SD 32.77194, METHODS.md §2)
    expect(r.swc).toBeCloseTo(6.5543878, 6);
    expect(r.sensitivity?.rating).toBe("borderline");
    expect(r.sensitivity?.ratio).toBeCloseTo(7.55693 / 6.5543878, 4);
    // 7.557/√2 = 5.34 < 6.55, one trial is not enough
    expect(r.trialsNeeded).toBe(2);
    expect(r.planner.map((p) => p.power)).toEqual([0.7, 0.8, 0.9, 0.95]);
    expect(r.planner.find((p) => p.power === 0.8)?.athletes).toBe(r.athletesNeeded);
    const counts = r.planner.map((p) => p.athletes ?? 0);
    expect([...counts].sort((a, b) => a - b)).toEqual(counts);
    expect(r.pairs[0]).toEqual({ athleteId: 1, name: "A1", first: 146, second: 140 });
  });

  it("leaves out flagged and missing scores, and names them", () => {
    const withGaps = [
      ...rows,
      { athleteId: 9, name: "Flagged", pre: score(150), post: { value: null, flag: "injured" as const } },
      { athleteId: 10, name: "Missing", pre: score(150), post: null },
      { athleteId: 11, name: "Not tested", pre: null, post: null },
    ];
    const r = buildReliabilityReport({ test, rows: withGaps, confidence: 0.95 });
    expect(r.n).toBe(8);
    expect(r.excluded).toEqual([
      { athleteId: 9, name: "Flagged", reason: "flagged-post", flag: "injured" },
      { athleteId: 10, name: "Missing", reason: "no-post", flag: null },
    ]);
  });

  it("refuses fewer than two pairs", () => {
    expect(() => buildReliabilityReport({ test, rows: rows.slice(0, 1), confidence: 0.95 })).toThrow(StatsInputError);
  });

  it("has no sensitivity or plan when the SWC is zero", () => {
    const r = buildReliabilityReport({ test: { ...test, swcMethod: "fixed", swcValue: 0 }, rows, confidence: 0.9 });
    expect(r.sensitivity).toBeNull();
    expect(r.athletesNeeded).toBeNull();
    expect(r.trialsNeeded).toBeNull();
  });
});

describe("Koo & Li (2016) bands", () => {
  it("cuts at 0.50, 0.75 and 0.90 (lower end inclusive, as R effectsize::interpret_icc)", () => {
    expect([0.49, 0.5, 0.749, 0.75, 0.899, 0.9].map(kooLiBand)).toEqual([
      "poor",
      "moderate",
      "moderate",
      "good",
      "good",
      "excellent",
    ]);
    expect(KOO_LI_LABELS.good).toBe("Good");
    expect(explainIcc("good", "moderate", "excellent")).toMatch(/spans moderate to excellent/);
  });
});
