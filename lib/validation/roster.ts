import { z } from "zod";
import { SEXES } from "@/lib/domain";
import { aliasList, idSchema, optionalIsoDate, optionalText, requiredText } from "./common";

export const squadCreateSchema = z.object({
  name: requiredText(80, "Squad name"),
  sport: optionalText(60, "Sport"),
});
export type SquadCreateInput = z.infer<typeof squadCreateSchema>;

export const squadUpdateSchema = z.object({
  name: requiredText(80, "Squad name").optional(),
  sport: optionalText(60, "Sport").optional(),
  archived: z.boolean().optional(),
  /** The full list of coaches for the squad (replaces the current list). */
  coachUserIds: z.array(idSchema).max(50).optional(),
});
export type SquadUpdateInput = z.infer<typeof squadUpdateSchema>;

const athleteFields = {
  name: requiredText(120, "Name"),
  dateOfBirth: optionalIsoDate,
  sex: z
    .enum(SEXES)
    .nullish()
    .transform((v) => v ?? null),
  position: optionalText(60, "Position or event"),
  externalId: optionalText(60, "External id"),
  notes: optionalText(2000, "Notes", { multiline: true }),
  /** Day the athlete's consent was recorded; without it they are not shown their results. */
  consentRecordedOn: optionalIsoDate,
  /** Under 18: day a parent's or guardian's consent was recorded (lib/consent.ts). */
  guardianConsentOn: optionalIsoDate,
  /** Other spellings of the name that files use ("L. Dempsey"); the Import reads them as this athlete. */
  aliases: aliasList,
};

export const athleteCreateSchema = z.object({ ...athleteFields, aliases: athleteFields.aliases.default([]) });
export type AthleteCreateInput = z.infer<typeof athleteCreateSchema>;

/** Adds an athlete to a squad: either an existing athlete by id, or a new one. */
export const squadAthleteAddSchema = z.union([z.object({ athleteId: idSchema }), athleteCreateSchema]);
export type SquadAthleteAddInput = z.infer<typeof squadAthleteAddSchema>;

export const athleteUpdateSchema = z.object({
  ...Object.fromEntries(Object.entries(athleteFields).map(([k, v]) => [k, v.optional()])),
  archived: z.boolean().optional(),
  /** The full list of squads the athlete belongs to (moving = replacing the list). */
  squadIds: z.array(idSchema).max(50).optional(),
}) as z.ZodType<Partial<AthleteCreateInput> & { archived?: boolean; squadIds?: number[] }>;
export type AthleteUpdateInput = z.infer<typeof athleteUpdateSchema>;
