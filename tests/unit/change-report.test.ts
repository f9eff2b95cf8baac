/**
 * The Change report's composition, checked against values computed outside lib/stats:
 * Student's sleep data (R datasets::sleep, METHODS.md §1.3, R 4.2.2 t.test output) and
 * plain arithmetic with jStat's t quantile for the rest.
 */
import jstatPkg from "jstat";
import { describe, expect, it } from "vitest";
import { buildChangeReport, type ReportRow, type ReportTest } from "@/lib/reports/change-report";
import { StatsInputError } from "@/lib/stats";
import { expectRelClose } from "../stats/close";

const jStat = (jstatPkg as unknown as { jStat?: typeof jstatPkg }).jStat ?? jstatPkg;

const G1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const G2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

const rowsOf = (pre: number[], post: number[]): ReportRow[] =>
  pre.map((v, i) => ({
    athleteId: i + 1,
    name: `Athlete ${i + 1}`,
    pre: { value: v, flag: null },
    post: { value: post[i], flag: null },
  }));

const higher: ReportTest = {
  direction: "higher",
  swcMethod: "sd-factor",
  swcValue: 0.2,
  cvPercent: null,
  typicalError: null,
  typicalErrorDf: null,
};

describe("buildChangeReport", () => {
  it("matches R's paired t.test on the sleep data (90 % interval, g2 − g1)", () => {
    const report = buildChangeReport({ test: higher, rows: rowsOf(G1, G2), confidence: 0.9 });
    expect(report.squad.n).toBe(10);
    expect(report.squad.df).toBe(9);
    expectRelClose(report.squad.meanDiff, 1.58, 1e-12);
    expectRelClose(report.squad.t!, 4.062127683, 1e-9);
    expectRelClose(report.squad.ciLower, 0.86699, 1e-5); // METHODS.md §1.3 [C]
    expectRelClose(report.squad.ciUpper, 2.29301, 1e-5);
    expectRelClose(report.squad.tCritical, 1.833113, 1e-6); // NIST table t0.95(9) = 1.833
    // SWC 0.2 × SD of the pre scores: SD1 = 1.78901 (METHODS.md §1.3)
    expectRelClose(report.squad.swc, 0.2 * 1.78901, 1e-5);
    expect(report.squad.verdict).toBe("clear-gain");
    expect(report.squad.individualResponseSd).toBeNull();
    expect(report.athletes.every((a) => a.ciLower === null && a.verdict === null)).toBe(true);
  });

  it("orients a lower-is-better test so that a faster time is a gain", () => {
    const pre = [1.9, 1.85, 1.95, 1.88, 1.92, 1.87];
    const post = [1.84, 1.83, 1.9, 1.85, 1.86, 1.83];
    const test: ReportTest = { ...higher, direction: "lower", swcMethod: "fixed", swcValue: 0.01 };
    const report = buildChangeReport({ test, rows: rowsOf(pre, post), confidence: 0.9 });
    const d = post.map((v, i) => v - pre[i]);
    const mean = d.reduce((a, b) => a + b) / d.length;
    const sd = Math.sqrt(d.reduce((a, b) => a + (b - mean) ** 2, 0) / (d.length - 1));
    const q = jStat.studentt.inv(0.95, d.length - 1);
    expectRelClose(report.squad.meanDiff, mean, 1e-12);
    // jStat's t quantile is good to about 1e-7; t quantiles are held to 1e-6 (PRODUCT.md §9).
    expectRelClose(report.squad.ciUpper, mean + (q * sd) / Math.sqrt(d.length), 1e-6);
    expect(report.squad.meanDiff).toBeLessThan(0);
    // The whole interval is below −0.01 s raw, so above +SWC once oriented.
    expect(report.squad.ciUpper).toBeLessThan(-0.01);
    expect(report.squad.verdict).toBe("clear-gain");
    expect(report.athletes[0].betterChange).toBeCloseTo(0.06, 12);
    expect(report.squad.shareBeyondSwc).toBeCloseTo(6 / 6, 12);
  });

  it("gives each athlete an interval from the typical error (t on its df) and the SD of individual responses", () => {
    const test: ReportTest = { ...higher, typicalError: 0.5, typicalErrorDf: 19 };
    const report = buildChangeReport({ test, rows: rowsOf(G1, G2), confidence: 0.9 });
    const q = jStat.studentt.inv(0.95, 19);
    const first = report.athletes[0];
    expectRelClose(first.ciLower!, 1.2 - q * Math.SQRT2 * 0.5, 1e-6);
    expectRelClose(first.ciUpper!, 1.2 + q * Math.SQRT2 * 0.5, 1e-6);
    // Atkinson & Batterham (2015): √(SD_change² − 2·TE²), SD_change = 1.2299955 (METHODS.md §1.3)
    expectRelClose(report.squad.individualResponseSd!, Math.sqrt(1.2299955 ** 2 - 2 * 0.25), 1e-6);
    const noisy = buildChangeReport({ test: { ...test, typicalError: 2 }, rows: rowsOf(G1, G2), confidence: 0.9 });
    expect(noisy.squad.individualResponseSd).toBe(0);
  });

  it("lists athletes without both scores, or flagged, as excluded with the reason", () => {
    const rows = rowsOf(G1, G2);
    rows[1].post = null;
    rows[2].pre = { value: null, flag: "injured" };
    rows[3].post = { value: 2.1, flag: "invalid" };
    rows[4].pre = null;
    const report = buildChangeReport({ test: higher, rows, confidence: 0.9 });
    expect(report.squad.n).toBe(6);
    expect(report.excluded.map((e) => [e.athleteId, e.reason, e.flag])).toEqual([
      [2, "no-post", null],
      [3, "flagged-pre", "injured"],
      [4, "flagged-post", "invalid"],
      [5, "no-pre", null],
    ]);
  });

  it("takes an SWC override: fixed, or a factor × CV% of the mean pre score", () => {
    const fixed = buildChangeReport({
      test: higher,
      rows: rowsOf(G1, G2),
      confidence: 0.95,
      swc: { method: "fixed", value: 1 },
    });
    expect(fixed.squad.swc).toBe(1);
    expect(fixed.settings.swcSource).toBe("report");
    // 0.3 × CV 2 % × mean pre 0.75 → 0.0045 (METHODS.md §2 formula)
    const cv = buildChangeReport({
      test: { ...higher, cvPercent: 2 },
      rows: rowsOf(G1, G2),
      confidence: 0.95,
      swc: { method: "cv-factor", value: 0.3 },
    });
    expectRelClose(cv.squad.swc, (0.3 * 2 * 0.75) / 100, 1e-12);
    expect(() =>
      buildChangeReport({
        test: higher,
        rows: rowsOf(G1, G2),
        confidence: 0.9,
        swc: { method: "cv-factor", value: 0.3 },
      }),
    ).toThrow(StatsInputError);
  });

  it("refuses fewer than two pairs", () => {
    const rows = rowsOf([40, 41], [42, 43]);
    rows[1].post = null;
    expect(() => buildChangeReport({ test: higher, rows, confidence: 0.9 })).toThrow(/At least 2 athletes/);
  });
});
