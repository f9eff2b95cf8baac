/**
 * The Change report's settings as they travel in its URL (`/reports/change?testId=…`): the page
 * and `GET /api/reports/change` read them with this one schema, so a shared link always means
 * the same report.
 */
import { z } from "zod";
import { REPORT_CONFIDENCES, SWC_METHODS } from "@/lib/domain";
import { requiredText } from "./common";

/** A record id as it travels in a query string: a canonical positive integer. */
export const queryId = (label: string) =>
  z
    .string({ message: `${label} is required.` })
    .regex(/^[1-9][0-9]{0,15}$/, `${label} must be a record id.`)
    .transform(Number)
    .refine(Number.isSafeInteger, `${label} must be a record id.`);

export const changeReportQuerySchema = z
  .object({
    testId: queryId("The test"),
    fromSessionId: queryId("The first session"),
    toSessionId: queryId("The second session"),
    confidence: z
      .string()
      .optional()
      .transform((v) => (v === undefined || v === "" ? 0.9 : Number(v)))
      .refine((v) => (REPORT_CONFIDENCES as readonly number[]).includes(v), "Confidence is 0.8, 0.9, 0.95 or 0.99."),
    swcMethod: z.enum(SWC_METHODS, { message: "The SWC method is sd-factor, fixed or cv-factor." }).optional(),
    swcValue: z
      .string()
      .optional()
      .transform((v) => (v === undefined || v.trim() === "" ? undefined : Number(v.replace(",", "."))))
      .refine(
        (v) => v === undefined || (Number.isFinite(v) && v >= 0 && v <= 1e6),
        "The SWC value must be a number, zero or more.",
      ),
  })
  .refine((q) => q.fromSessionId !== q.toSessionId, {
    message: "Choose two different sessions.",
    path: ["toSessionId"],
  })
  .refine((q) => q.swcMethod === undefined || q.swcValue !== undefined, {
    message: "Give the SWC value (a factor, or a fixed value in the test's unit) with its method.",
    path: ["swcValue"],
  });

export type ChangeReportQuery = z.infer<typeof changeReportQuerySchema>;

/** Reads the schema's fields from URL search params (the first of repeated names). */
export function searchParamsObject(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of params) if (!(key in out)) out[key] = value;
  return out;
}

/** A Change report saved with its interpretation note: the settings to recompute it from, and the note. */
export const savedReportCreateSchema = z.object({
  testId: z.number().int().positive(),
  fromSessionId: z.number().int().positive(),
  toSessionId: z.number().int().positive(),
  confidence: z
    .number()
    .refine((v) => (REPORT_CONFIDENCES as readonly number[]).includes(v), "Confidence is 0.8, 0.9, 0.95 or 0.99."),
  swcMethod: z.enum(SWC_METHODS).optional(),
  swcValue: z.number().finite().min(0).max(1e6).optional(),
  note: requiredText(5000, "The interpretation note", { multiline: true }),
});
export type SavedReportCreateInput = z.infer<typeof savedReportCreateSchema>;

/** Confidence levels the Reliability check offers; 95 % is the usual choice for reading an ICC (Koo & Li 2016). */
export const RELIABILITY_CONFIDENCES = [0.9, 0.95] as const;

/** The Reliability check's settings as they travel in its URL and in `GET /api/reports/reliability`. */
export const reliabilityQuerySchema = z
  .object({
    testId: queryId("The test"),
    firstSessionId: queryId("The first session"),
    secondSessionId: queryId("The second session"),
    confidence: z
      .string()
      .optional()
      .transform((v) => (v === undefined || v === "" ? 0.95 : Number(v)))
      .refine((v) => (RELIABILITY_CONFIDENCES as readonly number[]).includes(v), "Confidence is 0.9 or 0.95."),
  })
  .refine((q) => q.firstSessionId !== q.secondSessionId, {
    message: "Choose two different sessions.",
    path: ["secondSessionId"],
  });
export type ReliabilityQuery = z.infer<typeof reliabilityQuerySchema>;

const recordId = z.number().int().positive().max(Number.MAX_SAFE_INTEGER);

/** Characters a two-trial file may hold: far more than 2 000 rows of scores need. */
export const MAX_TWO_TRIAL_CHARS = 200_000;

/** A two-trial file as the Reliability check sends it: the text, and the name it had on disk. */
const twoTrialFile = {
  fileName: requiredText(200, "The file name"),
  csv: z
    .string({ message: "The file's text is required." })
    .min(1, "The file is empty.")
    .max(MAX_TWO_TRIAL_CHARS, `A two-trial file is limited to ${MAX_TWO_TRIAL_CHARS.toLocaleString("en")} characters.`),
};

/** `POST /api/reports/reliability/file`: a Reliability check of a two-trial file, scored in a test's unit. */
export const reliabilityFileSchema = z.object({
  testId: recordId,
  confidence: z
    .number()
    .refine((v) => (RELIABILITY_CONFIDENCES as readonly number[]).includes(v), "Confidence is 0.9 or 0.95."),
  ...twoTrialFile,
});
export type ReliabilityFileInput = z.infer<typeof reliabilityFileSchema>;

/**
 * Adopting a measured typical error: the two sessions of the study, or the two-trial file it was
 * measured in. Either way the server recomputes it; no figure is taken from the client.
 */
export const typicalErrorAdoptSchema = z.union(
  [
    z
      .object({ firstSessionId: recordId, secondSessionId: recordId })
      .refine((q) => q.firstSessionId !== q.secondSessionId, {
        message: "Choose two different sessions.",
        path: ["secondSessionId"],
      }),
    z.object(twoTrialFile),
  ],
  { message: "Send the two sessions of the study (firstSessionId, secondSessionId) or its file (fileName, csv)." },
);
export type TypicalErrorAdoptInput = z.infer<typeof typicalErrorAdoptSchema>;
