/** The typo guard's reasons in words a coach reads beside the cell and in the publish dialog. */
import { formatValue } from "@/lib/labels";
import { HISTORY_BETWEEN_SDS, HISTORY_TYPICAL_ERRORS, type SuspectReason } from "@/lib/suspect";

type Unit = { unit: string; decimals: number };

const range = (min: number | null, max: number | null, unit: string) =>
  min !== null && max !== null
    ? `${min}–${max} ${unit}`
    : min !== null
      ? `at least ${min} ${unit}`
      : `at most ${max} ${unit}`;

/** One reason, e.g. "outside the plausible range 1.5–2.6 s". */
export function suspectWords(reason: SuspectReason, { unit, decimals }: Unit): string {
  const v = (x: number) => `${formatValue(x, decimals)} ${unit}`;
  switch (reason.code) {
    case "outside-plausible":
      return `outside the plausible range ${range(reason.min, reason.max, unit)}`;
    case "far-from-history":
      return `far from the last published ${v(reason.previous)} (more than ${
        reason.basis === "typical-error"
          ? `${HISTORY_TYPICAL_ERRORS} typical errors`
          : `${HISTORY_BETWEEN_SDS} between-athlete SDs`
      }, ${v(reason.limit)})`;
    case "far-from-trials":
      return `far from the other trials (median ${v(reason.median)})`;
  }
}

/** All reasons of one score as a sentence fragment: "outside …; far from …". */
export const suspectSentence = (reasons: SuspectReason[], unit: Unit) =>
  reasons.map((r) => suspectWords(r, unit)).join("; ");
