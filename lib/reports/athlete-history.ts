/**
 * Athlete history's numbers: one athlete's scores in one test over time, and each score's change
 * from the athlete's previous usable score, read against the test's typical error and SWC. No
 * formula lives here; the interval and verdict come from lib/stats.
 */
import type { Direction, Phase, ResultFlag, SessionStatus, SwcMethod } from "@/lib/domain";
import { individualChange, swcFromCv, type Verdict } from "@/lib/stats";

export type HistoryScore = {
  resultId: number;
  sessionId: number;
  date: string;
  phase: Phase;
  status: SessionStatus;
  squadName: string;
  value: number | null;
  flag: ResultFlag | null;
};

export type HistoryTest = {
  id: number;
  name: string;
  unit: string;
  decimals: number;
  direction: Direction;
  swcMethod: SwcMethod;
  swcValue: number;
  cvPercent: number | null;
  typicalError: number | null;
  typicalErrorDf: number | null;
  /** Oldest first. */
  scores: HistoryScore[];
};

/**
 * Why a verdict can or cannot be given for one athlete alone:
 * - `fixed`: the test's fixed SWC; `cv`: factor × CV% of the athlete's previous score;
 * - `squad`: factor × between-athlete SD of the previous session's scores, where the caller
 *   supplies it (`HistoryOptions.squadSwc`) — per change, and only where the squad allows;
 * - `needs-squad`: an SD-based SWC is a spread of a squad's baseline, which one athlete has not got;
 * - `no-cv`: a CV-based SWC without a CV; `no-te`: no typical error, so no interval at all.
 */
export type SwcBasis = "fixed" | "cv" | "squad" | "needs-squad" | "no-cv" | "no-te";

export type HistoryOptions = {
  /**
   * The SD-based SWC of the squad's scores in a session (the one a change starts from), or null
   * where the caller will not give one. Without it an SD-based test gets no verdicts.
   */
  squadSwc?: (sessionId: number) => number | null;
};

function basisOf(test: HistoryTest, options: HistoryOptions): SwcBasis {
  if (test.typicalError === null) return "no-te";
  if (test.swcMethod === "fixed") return "fixed";
  if (test.swcMethod === "cv-factor") return test.cvPercent === null ? "no-cv" : "cv";
  return options.squadSwc ? "squad" : "needs-squad";
}

const usable = (s: HistoryScore): s is HistoryScore & { value: number } => s.flag === null && s.value !== null;

export type HistoryPoint = HistoryScore & {
  previousSessionId: number | null;
  /** This score − the previous usable one, in the test's unit. */
  change: number | null;
  /** The change with "better" positive. */
  betterChange: number | null;
  /** The SWC the verdict was read against, in the test's unit. */
  swc: number | null;
  ciLower: number | null;
  ciUpper: number | null;
  verdict: Verdict | null;
};

/** Each score with its change from the previous usable score and, where the test allows, interval and verdict. */
export function historyOfTest(test: HistoryTest, confidence: number, options: HistoryOptions = {}) {
  const higherIsBetter = test.direction === "higher";
  const basis = basisOf(test, options);
  let previous: (HistoryScore & { value: number }) | null = null;
  const scores = test.scores.map((score): HistoryPoint => {
    const empty: HistoryPoint = {
      ...score,
      previousSessionId: null,
      change: null,
      betterChange: null,
      swc: null,
      ciLower: null,
      ciUpper: null,
      verdict: null,
    };
    if (!usable(score)) return empty;
    const pre = previous;
    previous = score;
    if (pre === null) return empty;
    const change = score.value - pre.value;
    const withChange: HistoryPoint = {
      ...empty,
      previousSessionId: pre.sessionId,
      change,
      betterChange: higherIsBetter ? change : 0 - change,
    };
    const swc =
      basis === "fixed"
        ? test.swcValue
        : basis === "cv" && pre.value !== 0
          ? swcFromCv(Math.abs(pre.value), test.cvPercent!, test.swcValue)
          : basis === "squad"
            ? (options.squadSwc?.(pre.sessionId) ?? null)
            : null;
    if (test.typicalError === null || swc === null) return withChange;
    const individual = individualChange({
      pre: pre.value,
      post: score.value,
      typicalError: test.typicalError,
      typicalErrorDf: test.typicalErrorDf ?? undefined,
      swc,
      confidence,
      higherIsBetter,
    });
    return {
      ...withChange,
      swc,
      ciLower: individual.ciLower,
      ciUpper: individual.ciUpper,
      verdict: individual.verdict,
    };
  });
  const { swcMethod: _m, swcValue: _v, cvPercent: _c, scores: _s, ...shown } = test;
  return { ...shown, swcMethod: test.swcMethod, swcBasis: basis, scores };
}

/**
 * The athlete's best usable score in a test, by its direction (the highest jump, the fastest
 * time); the earliest session holding it when it was equalled later.
 */
export function personalBest<S extends HistoryScore>(scores: S[], direction: Direction): S | null {
  let best: S | null = null;
  for (const s of scores) {
    if (!usable(s)) continue;
    if (best === null || (direction === "higher" ? s.value > best.value! : s.value < best.value!)) best = s;
  }
  return best;
}
