import { z } from "zod";
import { MAX_TRIALS, PHASES, RESULT_FLAGS, SESSION_STATUSES } from "@/lib/domain";
import { isStorableTrial, TRIAL_RANGE_TEXT } from "@/lib/trials";
import { idSchema, isoDate, optionalText } from "./common";

export const sessionCreateSchema = z.object({
  squadId: idSchema,
  date: isoDate,
  phase: z.enum(PHASES, { message: "Choose the phase of the block." }),
  testIds: z.array(idSchema).min(1, "Pick at least one test for the battery.").max(30),
  notes: optionalText(2000, "Notes", { multiline: true }),
});
export type SessionCreateInput = z.infer<typeof sessionCreateSchema>;

export const sessionUpdateSchema = z.object({
  version: z.number().int().positive(),
  date: isoDate.optional(),
  phase: z.enum(PHASES).optional(),
  status: z.enum(SESSION_STATUSES).optional(),
  notes: optionalText(2000, "Notes", { multiline: true }).optional(),
  testIds: z.array(idSchema).min(1).max(30).optional(),
});
export type SessionUpdateInput = z.infer<typeof sessionUpdateSchema>;

/** A trial score as typed: a number Changewise can store as given, or null for an empty slot. */
export const trialValue = z
  .number({ message: "Scores must be numbers." })
  .refine(isStorableTrial, `Scores must be ${TRIAL_RANGE_TEXT}.`)
  .nullable();

const resultWriteSchema = z.object({
  athleteId: idSchema,
  testId: idSchema,
  trials: z.array(trialValue).max(MAX_TRIALS, `At most ${MAX_TRIALS} trials.`),
  flag: z.enum(RESULT_FLAGS).nullable().default(null),
  note: optionalText(500, "Note"),
  /** The version the writer read; null when the cell had no result yet. */
  version: z.number().int().positive().nullable(),
});
export type ResultWriteInput = z.infer<typeof resultWriteSchema>;

export const resultsBatchSchema = z.object({
  results: z.array(resultWriteSchema).min(1, "Nothing to save.").max(5000, "Save at most 5000 results at once."),
});

/** `DELETE /api/sessions/[id]?results=N`: the number of results the person saw in the confirm step. */
export const sessionDeleteQuerySchema = z.object({
  results: z
    .string({ message: "Say how many results you confirmed deleting (results=…)." })
    .regex(/^(0|[1-9][0-9]{0,8})$/, "The number of results is a whole number.")
    .transform(Number),
});
