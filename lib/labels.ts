import type { Phase, ResultFlag, SessionStatus, TrialRule } from "@/lib/domain";

export const PHASE_LABELS: Record<Phase, string> = {
  baseline: "Baseline",
  "pre-block": "Pre-block",
  "post-block": "Post-block",
  retest: "Retest",
  "in-season": "In-season check",
};

export const STATUS_LABELS: Record<SessionStatus, string> = { draft: "Draft", published: "Published" };

export const FLAG_LABELS: Record<ResultFlag, string> = { absent: "Absent", injured: "Injured", invalid: "Invalid" };

/** "2026-09-14" → "14 Sep 2026", without time-zone drift. */
export function formatDate(isoDate: string): string {
  const [y, m, d] = isoDate.split("-").map(Number);
  if (!y || !m || !d) return isoDate;
  return new Date(Date.UTC(y, m - 1, d)).toLocaleDateString("en-GB", {
    day: "numeric",
    month: "short",
    year: "numeric",
    timeZone: "UTC",
  });
}

export function formatValue(value: number | null | undefined, decimals: number): string {
  return value === null || value === undefined || !Number.isFinite(value) ? "–" : value.toFixed(decimals);
}

/** A moment (ms since 1970) as "2026-09-14 18:05 UTC": the same on the server and in any browser. */
export function formatMoment(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** How a test turns its trials into the session's score: "Best of 3", "Mean of 2", or "One trial". */
export function trialRuleWords(rule: TrialRule, trials: number): string {
  if (trials === 1) return "One trial";
  return `${rule === "best" ? "Best" : "Mean"} of ${trials}`;
}
