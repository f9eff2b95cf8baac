import { z } from "zod";
import { DIRECTIONS, MAX_TRIALS, SWC_METHODS, TRIAL_RULES } from "@/lib/domain";
import { aliasList, optionalText, requiredText } from "./common";

const fields = {
  name: requiredText(80, "Name"),
  unit: requiredText(20, "Unit"),
  decimals: z.number().int().min(0, "0 to 4 decimals.").max(4, "0 to 4 decimals."),
  direction: z.enum(DIRECTIONS, { message: "Choose whether higher or lower is better." }),
  trialRule: z.enum(TRIAL_RULES, { message: "Choose best or mean of trials." }),
  trialsPerSession: z.number().int().min(1, "At least one trial.").max(MAX_TRIALS, `At most ${MAX_TRIALS} trials.`),
  swcMethod: z.enum(SWC_METHODS),
  swcValue: z.number().finite().positive("The SWC setting must be above zero."),
  cvPercent: z.number().finite().positive("CV% must be above zero.").max(100).nullable(),
  typicalError: z.number().finite().min(0, "The typical error cannot be negative.").nullable(),
  typicalErrorDf: z.number().int().min(1, "Degrees of freedom must be at least 1.").max(100000).nullable(),
  typicalErrorSource: optionalText(300, "Source note"),
  plausibleMin: z.number().finite().nullable(),
  plausibleMax: z.number().finite().nullable(),
  aliases: aliasList,
};

type RangeLike = {
  plausibleMin?: number | null;
  plausibleMax?: number | null;
  swcMethod?: string;
  cvPercent?: number | null;
};

const rangeIsOrdered = (v: RangeLike) =>
  v.plausibleMin === null ||
  v.plausibleMin === undefined ||
  v.plausibleMax === null ||
  v.plausibleMax === undefined ||
  v.plausibleMin < v.plausibleMax;

/** Creating a test in the Test library. */
export const testCreateSchema = z
  .object({
    ...fields,
    decimals: fields.decimals.default(2),
    trialRule: fields.trialRule.default("best"),
    trialsPerSession: fields.trialsPerSession.default(3),
    swcMethod: fields.swcMethod.default("sd-factor"),
    swcValue: fields.swcValue.default(0.2),
    cvPercent: fields.cvPercent.default(null),
    typicalError: fields.typicalError.default(null),
    typicalErrorDf: fields.typicalErrorDf.default(null),
    plausibleMin: fields.plausibleMin.default(null),
    plausibleMax: fields.plausibleMax.default(null),
    aliases: fields.aliases.default([]),
  })
  .refine(rangeIsOrdered, { message: "The lowest plausible value must be below the highest.", path: ["plausibleMax"] })
  .refine((v) => v.swcMethod !== "cv-factor" || v.cvPercent !== null, {
    message: "A CV-based SWC needs the test's CV%.",
    path: ["cvPercent"],
  });
export type TestCreateInput = z.infer<typeof testCreateSchema>;

/** Editing a test: any subset of fields, plus the version that was read. */
export const testUpdateSchema = z
  .object({ ...fields, archived: z.boolean() })
  .partial()
  .extend({ version: z.number().int().positive() })
  .refine(rangeIsOrdered, { message: "The lowest plausible value must be below the highest.", path: ["plausibleMax"] });
export type TestUpdateInput = z.infer<typeof testUpdateSchema>;
