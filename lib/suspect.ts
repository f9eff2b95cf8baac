/**
 * The typo guard: is a score likely a slip of the finger (17.60 typed for 1.76)? A suspect
 * score is still saved — the coach may be right — but it is announced and explained wherever
 * scores are typed, imported or published. One rule for the Session sheet, the results API and
 * the import.
 */
import { median } from "simple-statistics";

/** What the rule knows about the test and the athlete, besides the score itself. */
export type SuspectContext = {
  plausibleMin: number | null;
  plausibleMax: number | null;
  /** The test's typical error in its unit, when one is set. */
  typicalError: number | null;
  /** The squad's between-athlete SD of their latest earlier scores (null with fewer than 3). */
  betweenAthleteSd: number | null;
  /** The athlete's latest score of this test in an earlier published session. */
  previous: number | null;
};

export type SuspectReason =
  | { code: "outside-plausible"; min: number | null; max: number | null }
  | { code: "far-from-history"; previous: number; limit: number; basis: "typical-error" | "between-athlete-sd" }
  | { code: "far-from-trials"; median: number; limit: number };

/**
 * From the athlete's last published score, in typical errors. The difference of two noisy
 * measurements has an SD of √2·TE, and a real change over one training block rarely reaches
 * 3 TE, so 6 TE is far beyond both together (our convention).
 */
export const HISTORY_TYPICAL_ERRORS = 6;
/**
 * Without a typical error, in between-athlete SDs: a block moves a squad by about 0.2–0.5 SD
 * (common practice), so an athlete moving 1.5 SD since their last test is worth a second look.
 */
export const HISTORY_BETWEEN_SDS = 1.5;
/**
 * Between trials of one session, in typical errors from the trials' median: trial-to-trial noise
 * within a session is at most about one TE, so 4 TE is far outside it (our convention).
 */
export const TRIAL_TYPICAL_ERRORS = 4;
/** Without a typical error, a trial 15 % away from the trials' median (field tests' CVs are mostly under 5 %). */
export const TRIAL_RELATIVE = 0.15;

/**
 * Why a score looks mistyped: outside the test's plausible range, far from the athlete's last
 * published score, or far from their other trials in this session. An empty list means the score
 * looks ordinary.
 *
 * The trials are compared with their median, which one mistyped trial out of three cannot move;
 * with two trials that disagree, both are suspect (only the other reasons can tell which is wrong).
 *
 * @param value the trial score to check
 * @param sessionTrials all of the athlete's trials of this test in the session, this one included (nulls ignored)
 * @example suspectReasons(17.6, [1.78, 17.6, 1.8], { plausibleMin: 1.5, plausibleMax: 2.6, typicalError: 0.03, betweenAthleteSd: 0.08, previous: 1.79 })
 * // → outside-plausible; far-from-history (limit 0.18 from 1.79); far-from-trials (limit 0.12 from the median 1.8)
 */
export function suspectReasons(
  value: number,
  sessionTrials: readonly (number | null)[],
  ctx: SuspectContext,
): SuspectReason[] {
  const reasons: SuspectReason[] = [];
  if (
    (ctx.plausibleMin !== null && value < ctx.plausibleMin) ||
    (ctx.plausibleMax !== null && value > ctx.plausibleMax)
  )
    reasons.push({ code: "outside-plausible", min: ctx.plausibleMin, max: ctx.plausibleMax });

  if (ctx.previous !== null) {
    const byTe = ctx.typicalError !== null && ctx.typicalError > 0;
    const limit = byTe
      ? HISTORY_TYPICAL_ERRORS * ctx.typicalError!
      : ctx.betweenAthleteSd !== null && ctx.betweenAthleteSd > 0
        ? HISTORY_BETWEEN_SDS * ctx.betweenAthleteSd
        : null;
    if (limit !== null && Math.abs(value - ctx.previous) > limit)
      reasons.push({
        code: "far-from-history",
        previous: ctx.previous,
        limit,
        basis: byTe ? "typical-error" : "between-athlete-sd",
      });
  }

  const trials = sessionTrials.filter((v): v is number => v !== null && Number.isFinite(v));
  if (trials.length > 1) {
    const centre = median(trials);
    const limit =
      ctx.typicalError !== null && ctx.typicalError > 0
        ? TRIAL_TYPICAL_ERRORS * ctx.typicalError
        : TRIAL_RELATIVE * Math.abs(centre);
    if (limit > 0 && Math.abs(value - centre) > limit) reasons.push({ code: "far-from-trials", median: centre, limit });
  }
  return reasons;
}

/** A suspect score as the results API and the import report it. */
export type Suspect = { athleteId: number; testId: number; trial: number; value: number; reasons: SuspectReason[] };

/**
 * Every suspect trial of one result, trials numbered from 1 as the sheet shows them. Two
 * refinements keep one slip from reading as several: of two trials that disagree, when only one
 * is also out of range or far from history, that one alone is the suspect; and when several
 * trials are far from the last published score (a real jump in form moves them all), only the
 * farthest carries that reason.
 */
export function suspectTrials(
  athleteId: number,
  testId: number,
  trials: readonly (number | null)[],
  ctx: SuspectContext,
): Suspect[] {
  let found: Suspect[] = [];
  trials.forEach((value, index) => {
    if (value === null) return;
    const reasons = suspectReasons(value, trials, ctx);
    if (reasons.length > 0) found.push({ athleteId, testId, trial: index + 1, value, reasons });
  });
  const far = found.filter((s) => s.reasons.some((r) => r.code === "far-from-history"));
  if (far.length > 1 && ctx.previous !== null) {
    const previous = ctx.previous;
    const farthest = far.reduce((a, b) => (Math.abs(b.value - previous) > Math.abs(a.value - previous) ? b : a));
    found = found
      .map((s) => (s === farthest ? s : { ...s, reasons: s.reasons.filter((r) => r.code !== "far-from-history") }))
      .filter((s) => s.reasons.length > 0);
  }
  const onlyApart = (s: Suspect) => s.reasons.every((r) => r.code === "far-from-trials");
  if (found.some((s) => !onlyApart(s))) return found.filter((s) => !onlyApart(s));
  return found;
}

/** What a session's typo guard knows: each test's range, TE and squad SD, each athlete's last published score. */
export type TypoGuard = {
  tests: {
    testId: number;
    plausibleMin: number | null;
    plausibleMax: number | null;
    typicalError: number | null;
    betweenAthleteSd: number | null;
  }[];
  previous: { athleteId: number; testId: number; value: number }[];
};

/** Looks up the context of one athlete's score of one test (null for a test the guard does not cover). */
export function typoGuardIndex(guard: TypoGuard): (athleteId: number, testId: number) => SuspectContext | null {
  const testsById = new Map(guard.tests.map((t) => [t.testId, t]));
  const previous = new Map(guard.previous.map((p) => [`${p.athleteId}:${p.testId}`, p.value]));
  return (athleteId, testId) => {
    const test = testsById.get(testId);
    if (!test) return null;
    return {
      plausibleMin: test.plausibleMin,
      plausibleMax: test.plausibleMax,
      typicalError: test.typicalError,
      betweenAthleteSd: test.betweenAthleteSd,
      previous: previous.get(`${athleteId}:${testId}`) ?? null,
    };
  };
}

/** The suspect trials among some results. */
export function findSuspects(
  guard: TypoGuard,
  rows: readonly { athleteId: number; testId: number; trials: readonly (number | null)[] }[],
): Suspect[] {
  const contextOf = typoGuardIndex(guard);
  return rows.flatMap((row) => {
    const ctx = contextOf(row.athleteId, row.testId);
    return ctx ? suspectTrials(row.athleteId, row.testId, row.trials, ctx) : [];
  });
}
