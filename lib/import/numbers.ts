import { isStorableTrial, TRIAL_RANGE_TEXT } from "@/lib/trials";
import type { Delimiter } from "./types";

/** A number, null for an empty cell, or a string saying why the cell is not a score (no object per cell). */
export type ScoreParse = number | null | string;
const PLAIN = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;
const COMMA = /^[+-]?(?:\d+(?:,\d*)?|,\d+)$/;

/**
 * Reads one trial score. `.` is always a decimal point. A comma is a decimal comma when the
 * file is not comma-separated (`;` or tab files come from spreadsheets set to a decimal-comma
 * locale). In a comma-separated file "1,500" could be a thousands separator, so it is refused
 * rather than guessed. Thousands separators, units and exponents are refused with a reason.
 * An empty cell is an empty trial.
 *
 * @example parseScore("1,86", ";") // 1.86
 */
export function parseScore(raw: string, delimiter: Delimiter): ScoreParse {
  // The common case first: a plain number with a decimal point and no spaces.
  if (PLAIN.test(raw)) return storable(Number(raw), raw);
  const text = raw.trim();
  if (text === "") return null;
  if (PLAIN.test(text)) return storable(Number(text), text);
  if (COMMA.test(text)) {
    if (delimiter === ",") {
      return `“${clip(text)}” has a comma, which is ambiguous in a comma-separated file (decimal or thousands?). Write it with a decimal point, or save the file with “;” as delimiter.`;
    }
    return storable(Number(text.replace(",", ".")), text);
  }
  if (/^[+-]?[\d.,'\s]+$/.test(text) && /\d/.test(text)) {
    return `“${clip(text)}” looks like a number with thousands separators or two decimal marks. Write it plainly, e.g. 1480 or 1.86.`;
  }
  // One way to split the digits, so a long cell cannot make the pattern backtrack quadratically.
  if (/^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)\s*[a-zA-Z%]+$/.test(text)) {
    return `“${clip(text)}” has a unit or letters after the number. Write the number only; the test's unit is known.`;
  }
  return `“${clip(text)}” is not a number.`;
}

const clip = (text: string) => (text.length > 40 ? `${text.slice(0, 40)}…` : text);

/**
 * A digit string too long for a double reads as Infinity (stored as nothing) or overflows a
 * mean, so the cell is refused here rather than stored as something other than what it says.
 */
function storable(value: number, text: string): ScoreParse {
  if (isStorableTrial(value)) return value;
  return `“${clip(text)}” is outside the range of a score (${TRIAL_RANGE_TEXT}). Check the cell.`;
}
