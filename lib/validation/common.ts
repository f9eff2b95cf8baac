import { z } from "zod";
import "./zod-config";

export const idSchema = z.number().int().positive();

// Text hygiene for every free-text field. Control characters never belong in stored text; bidi
// embeddings, overrides and isolates reorder what a reader sees (a name can be made to read
// backwards or hide part of itself); zero-width and other blank characters at the ends make
// look-alike names. Zero-width joiners inside a name stay: some scripts and emoji need them.
const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069]/g;
const LINE_BREAKS = /\r\n?|[\n\u0085\u2028\u2029]/g;
const SPACING_CONTROLS = /[\t\v\f]/g;
const OTHER_CONTROLS = /[\u0000-\u0008\u000E-\u001F\u007F-\u0084\u0086-\u009F]/g;
// Whitespace, zero-width characters, direction marks, word joiners, the BOM and letters that draw nothing.
const BLANK = "\\s\\u200B-\\u200F\\u2060-\\u2064\\u061C\\u180E\\uFEFF\\u115F\\u1160\\u3164\\uFFA0\\u2800";
const BLANK_ENDS = new RegExp(`^[${BLANK}]+|[${BLANK}]+$`, "g");
const BLANKS = new RegExp(`[${BLANK}]`, "g");
const VISIBLE = /[\p{L}\p{N}\p{P}\p{S}]/u;

/** Free text as it is stored: controls out, line breaks kept only where lines are wanted, ends trimmed. */
export function cleanText(value: string, { multiline = false } = {}): string {
  return value
    .replace(BIDI_CONTROLS, "")
    .replace(LINE_BREAKS, multiline ? "\n" : " ")
    .replace(SPACING_CONTROLS, " ")
    .replace(OTHER_CONTROLS, "")
    .replace(BLANK_ENDS, "");
}

/** At least one letter, digit, punctuation mark or symbol that draws something. */
export const hasVisibleText = (value: string) => VISIBLE.test(value.replace(BLANKS, ""));

type TextOptions = { multiline?: boolean };

/** Optional free text: cleaned (see cleanText), empty becomes null; otherwise it must show something. */
export const optionalText = (max: number, label = "This field", { multiline = false }: TextOptions = {}) =>
  z
    .string()
    .transform((v) => cleanText(v, { multiline }))
    .pipe(
      z
        .string()
        .max(max, `${label} is limited to ${max} characters.`)
        .refine(
          (v) => v === "" || hasVisibleText(v),
          `${label} needs at least one visible character, or leave it empty.`,
        ),
    )
    .nullish()
    .transform((v) => (v ? v : null));

/** Required free text: cleaned (see cleanText), with at least one visible character. */
export const requiredText = (max: number, label: string, { multiline = false }: TextOptions = {}) =>
  z
    .string()
    .transform((v) => cleanText(v, { multiline }))
    .pipe(
      z
        .string()
        .min(1, `${label} is required.`)
        .max(max, `${label} is limited to ${max} characters.`)
        .refine(hasVisibleText, `${label} needs at least one visible character.`),
    );

/** A real calendar date written YYYY-MM-DD. */
export const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2026-09-14.")
  .refine((value) => {
    const [y, m, d] = value.split("-").map(Number);
    const date = new Date(Date.UTC(y, m - 1, d));
    return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
  }, "That date does not exist.");

export const optionalIsoDate = isoDate.nullish().or(z.literal("").transform(() => null));

export const MAX_ALIASES = 12;
export const ALIAS_CHARS = 60;

/**
 * Other names a file may use ("CMJ, Counter movement jump"): typed comma-separated in a form, a
 * list in JSON. Each cleaned like any text; blanks dropped. Repeats and the owner's own name are
 * dropped where the owner is known (lib/aliases.ts).
 */
export const aliasList = z
  .preprocess(
    (value) => (typeof value === "string" ? value.split(",") : value),
    z.array(
      z.string({ message: "Other names are text, separated by commas." }).transform((v) => cleanText(v)),
      { message: "Other names are a list of names." },
    ),
  )
  .transform((list) => list.filter((alias) => alias !== "" && hasVisibleText(alias)))
  // Checked on the whole list, so the message lands beside the one field a form shows for it.
  .superRefine((list, ctx) => {
    const long = list.find((alias) => alias.length > ALIAS_CHARS);
    if (long)
      ctx.addIssue({
        code: "custom",
        message: `“${long.slice(0, 24)}…” is too long: each other name is limited to ${ALIAS_CHARS} characters.`,
      });
    if (list.length > MAX_ALIASES)
      ctx.addIssue({ code: "custom", message: `At most ${MAX_ALIASES} other names (${list.length} given).` });
  });
