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
  if (PLAIN.test(raw)) return Number(raw);
  const text = raw.trim();
  if (text === "") return null;
  if (PLAIN.test(text)) return Number(text);
  if (COMMA.test(text)) {
    if (delimiter === ",") {
      return `“${text}” has a comma, which is ambiguous in a comma-separated file (decimal or thousands?). Write it with a decimal point, or save the file with “;” as delimiter.`;
    }
    return Number(text.replace(",", "."));
  }
  if (/^[+-]?[\d.,'\s]+$/.test(text) && /\d/.test(text)) {
    return `“${text}” looks like a number with thousands separators or two decimal marks. Write it plainly, e.g. 1480 or 1.86.`;
  }
  if (/^[+-]?(?:\d+[.,]?\d*|[.,]\d+)\s*[a-zA-Z%]+$/.test(text)) {
    return `“${text}” has a unit or letters after the number. Write the number only; the test's unit is known.`;
  }
  return `“${text.length > 40 ? `${text.slice(0, 40)}…` : text}” is not a number.`;
}
