import { z } from "zod";

export const idSchema = z.number().int().positive();

/** Optional free text: trimmed, empty becomes null. */
export const optionalText = (max: number, label = "This field") =>
  z
    .string()
    .trim()
    .max(max, `${label} is limited to ${max} characters.`)
    .nullish()
    .transform((v) => (v ? v : null));

export const requiredText = (max: number, label: string) =>
  z.string().trim().min(1, `${label} is required.`).max(max, `${label} is limited to ${max} characters.`);

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
