import { parseScore } from "@/lib/import/numbers";

/**
 * Reads a typed score with the same rules as an imported cell of a `;` file: a decimal point
 * or a decimal comma ("2,31" → 2.31), as spreadsheets and timing-gate exports in many
 * countries write them (one value per cell, so a comma cannot be a thousands separator).
 * Empty text is an empty slot; anything else that is not a plain number is refused, never guessed.
 */
export type ParsedDecimal = { ok: true; value: number | null } | { ok: false; message: string };

export function parseDecimal(text: string): ParsedDecimal {
  const parsed = parseScore(text, ";");
  return typeof parsed === "string" ? { ok: false, message: parsed } : { ok: true, value: parsed };
}

/** For react-hook-form `setValueAs`: empty → null, a number → number, anything else → NaN (zod refuses it). */
export function numberOrNull(raw: unknown): number | null {
  if (typeof raw === "number") return Number.isNaN(raw) ? null : raw;
  if (raw === null || raw === undefined) return null;
  const parsed = parseDecimal(String(raw));
  return parsed.ok ? parsed.value : Number.NaN;
}

/** Like numberOrNull for required numbers: empty becomes NaN so the schema reports it. */
export function numberRequired(raw: unknown): number {
  const value = numberOrNull(raw);
  return value === null ? Number.NaN : value;
}

/**
 * A recorded number padded to the test's decimals so columns line up ("1.8" → "1.80"),
 * but never rounded: a value typed with more digits shows them all.
 */
export function paddedNumber(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  const written = String(value);
  if (written.includes("e")) return written;
  const digits = written.split(".")[1]?.length ?? 0;
  return value.toFixed(Math.max(decimals, digits));
}
