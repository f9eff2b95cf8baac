/**
 * The Change report's numbers: one test, two sessions of one squad. Pairs the athletes, says
 * why anyone is left out, and composes lib/stats — the squad's paired t-interval against the
 * SWC, each athlete's change against the test's typical error — into the payload the screen,
 * the CSV and saved reports share. No formula lives here; each comes from lib/stats.
 */

import type { Direction, ResultFlag, SwcMethod } from "@/lib/domain";
import {
  classifyChange,
  individualChange,
  magnitudeOfEffect,
  orientInterval,
  pairedChange,
  StatsInputError,
  smallestWorthwhileChange,
  swcFromCv,
  type Verdict,
} from "@/lib/stats";

export type ReportTest = {
  direction: Direction;
  swcMethod: SwcMethod;
  swcValue: number;
  cvPercent: number | null;
  typicalError: number | null;
  typicalErrorDf: number | null;
};

/** One athlete's stored score in a session, or null when they have none. */
export type SessionScore = { value: number | null; flag: ResultFlag | null } | null;

export type ReportRow = { athleteId: number; name: string; pre: SessionScore; post: SessionScore };

export type SwcSetting = { method: SwcMethod; value: number };

export type ExclusionReason = "no-pre" | "no-post" | "flagged-pre" | "flagged-post";

export type ChangeReportInput = {
  test: ReportTest;
  rows: ReportRow[];
  confidence: number;
  /** Overrides the test's own SWC method for this report. */
  swc?: SwcSetting;
};

/**
 * The SWC in the test's unit from the method and the paired athletes' pre scores.
 * @throws {StatsInputError} for a CV-based SWC when no CV is known
 */
export function reportSwc(setting: SwcSetting, pre: number[], cvPercent: number | null): number {
  switch (setting.method) {
    case "sd-factor":
      return smallestWorthwhileChange(pre, setting.value);
    case "fixed":
      if (!(setting.value >= 0)) throw new StatsInputError("A fixed SWC must be zero or more.");
      return setting.value;
    case "cv-factor": {
      if (cvPercent === null)
        throw new StatsInputError("A CV-based SWC needs the test's CV%; set it in the Test library.");
      const meanPre = pre.reduce((a, b) => a + b, 0) / pre.length;
      return swcFromCv(Math.abs(meanPre), cvPercent, setting.value);
    }
  }
}

/** Why a row cannot pair, or null when it can: a missing score, or a flagged one (absent, injured, invalid). */
export function exclusionOf(row: ReportRow): ExclusionReason | null {
  if (row.pre?.flag) return "flagged-pre";
  if (row.post?.flag) return "flagged-post";
  if (row.pre?.value == null) return "no-pre";
  if (row.post?.value == null) return "no-post";
  return null;
}

const percent = (change: number, base: number) => (base === 0 ? null : (100 * change) / Math.abs(base));

/**
 * Builds the report.
 * @throws {StatsInputError} when fewer than 2 athletes pair up, or the SWC cannot be computed
 */
export function buildChangeReport({ test, rows, confidence, swc: override }: ChangeReportInput) {
  const higherIsBetter = test.direction === "higher";
  const paired: { athleteId: number; name: string; pre: number; post: number }[] = [];
  const excluded: { athleteId: number; name: string; reason: ExclusionReason; flag: ResultFlag | null }[] = [];
  for (const row of rows) {
    const reason = exclusionOf(row);
    if (reason)
      excluded.push({
        athleteId: row.athleteId,
        name: row.name,
        reason,
        flag: row.pre?.flag ?? row.post?.flag ?? null,
      });
    else paired.push({ athleteId: row.athleteId, name: row.name, pre: row.pre!.value!, post: row.post!.value! });
  }
  if (paired.length < 2) {
    throw new StatsInputError(`At least 2 athletes need a score in both sessions (${paired.length} do).`);
  }

  const pre = paired.map((p) => p.pre);
  const squad = pairedChange(
    pre,
    paired.map((p) => p.post),
    { confidence },
  );
  const swcSetting = override ?? { method: test.swcMethod, value: test.swcValue };
  const swc = reportSwc(swcSetting, pre, test.cvPercent);
  const better = orientInterval(squad.ciLower, squad.ciUpper, higherIsBetter);
  const te = test.typicalError;

  const athletes = paired.map((p) => {
    const change = p.post - p.pre;
    const individual =
      te === null
        ? null
        : individualChange({
            pre: p.pre,
            post: p.post,
            typicalError: te,
            typicalErrorDf: test.typicalErrorDf ?? undefined,
            swc,
            confidence,
            higherIsBetter,
          });
    return {
      athleteId: p.athleteId,
      name: p.name,
      pre: p.pre,
      post: p.post,
      change,
      betterChange: higherIsBetter ? change : -change,
      percentChange: percent(change, p.pre),
      ciLower: individual?.ciLower ?? null,
      ciUpper: individual?.ciUpper ?? null,
      verdict: (individual?.verdict ?? null) as Verdict | null,
    };
  });

  const standardisedChange = squad.baselineSd > 0 ? squad.meanDiff / squad.baselineSd : null;
  return {
    settings: {
      confidence,
      swcMethod: swcSetting.method,
      swcValue: swcSetting.value,
      swcSource: override === undefined ? ("test" as const) : ("report" as const),
    },
    squad: {
      n: squad.n,
      df: squad.df,
      meanPre: squad.meanPre,
      meanPost: squad.meanPost,
      meanDiff: squad.meanDiff,
      percentChange: percent(squad.meanDiff, squad.meanPre),
      sdDiff: squad.sdDiff,
      standardError: squad.standardError,
      tCritical: squad.tCritical,
      ciLower: squad.ciLower,
      ciUpper: squad.ciUpper,
      t: squad.t,
      p: squad.p,
      effectSizeDz: squad.effectSizeDz,
      hedgesGz: squad.hedgesGz,
      baselineSd: squad.baselineSd,
      // Hopkins' scale reads a change in units of the between-athlete SD, not of the SD of changes.
      standardisedChange,
      magnitude: standardisedChange === null ? null : magnitudeOfEffect(standardisedChange),
      swc,
      shareBeyondSwc: athletes.filter((a) => a.betterChange > swc).length / athletes.length,
      shareBelowSwc: athletes.filter((a) => a.betterChange < -swc).length / athletes.length,
      verdict: classifyChange(better, swc),
      individualResponseSd: te === null ? null : Math.sqrt(Math.max(0, squad.sdDiff ** 2 - 2 * te ** 2)),
    },
    athletes,
    excluded,
  };
}

export type ChangeReport = ReturnType<typeof buildChangeReport>;
