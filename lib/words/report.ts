/**
 * How the Change report writes its numbers and codes for people: signed changes in the test's
 * unit, intervals, p-values, exclusion reasons and verdict sentences.
 */
import type { ExclusionReason } from "@/lib/reports/change-report";
import type { Verdict } from "@/lib/stats";

const minus = "−";

/** A number with its sign, as changes are read: "+1.4", "−0.03", "0.0". */
export function signed(value: number, decimals: number): string {
  const text = Math.abs(value).toFixed(decimals);
  if (Number(text) === 0) return text;
  return value < 0 ? `${minus}${text}` : `+${text}`;
}

/** A plain number with the typographic minus. */
export function plain(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return text.startsWith("-") ? `${minus}${text.slice(1)}` : text;
}

/** "+0.9 to +2.3 cm" */
export function intervalWords(lower: number, upper: number, decimals: number, unit: string): string {
  return `${signed(lower, decimals)} to ${signed(upper, decimals)} ${unit}`;
}

/** "0.003", or "< 0.001" where three decimals would show 0. */
export function pWords(p: number | null): string {
  if (p === null) return "–";
  return p < 0.001 ? "< 0.001" : p.toFixed(3);
}

export const percentWords = (value: number | null) => (value === null ? "–" : `${signed(value, 1)} %`);

export const confidenceWords = (confidence: number) => `${Math.round(confidence * 100)} %`;

export const EXCLUSION_WORDS: Record<ExclusionReason, string> = {
  "no-pre": "No score in the first session",
  "no-post": "No score in the second session",
  "flagged-pre": "Flagged in the first session",
  "flagged-post": "Flagged in the second session",
};

/** The same reasons for a row of a two-trial file. */
export const FILE_EXCLUSION_WORDS: Record<ExclusionReason, string> = {
  "no-pre": "No first trial",
  "no-post": "No second trial",
  "flagged-pre": "First trial flagged",
  "flagged-post": "Second trial flagged",
};

/** What the squad verdict says, in a sentence a coach can pass on (PRODUCT.md §5). */
export const SQUAD_VERDICT_SENTENCES: Record<Verdict, string> = {
  "clear-gain": "The squad improved by more than the smallest worthwhile change: the whole interval lies above it.",
  gain: "The squad improved, but the interval still reaches into the smallest-worthwhile-change band.",
  steady: "The squad held steady: the whole interval lies inside the smallest-worthwhile-change band.",
  decline: "The squad declined, but the interval still reaches into the smallest-worthwhile-change band.",
  "clear-decline": "The squad declined by more than the smallest worthwhile change: the whole interval lies below it.",
  inconclusive: "Inconclusive: the interval crosses zero and reaches past the band, so more data are needed to say.",
};

/** How the report's SWC was obtained, e.g. "0.2 × between-athlete SD of the first session's scores". */
export function swcSourceWords(
  method: "sd-factor" | "fixed" | "cv-factor",
  value: number,
  unit: string,
  fromTest: boolean,
): string {
  const how =
    method === "sd-factor"
      ? `${value} × between-athlete SD of the first session's scores`
      : method === "fixed"
        ? `a fixed ${value} ${unit}`
        : `${value} × CV% of the first session's mean`;
  return `${how} (${fromTest ? "the test's own method" : "set for this report"})`;
}
