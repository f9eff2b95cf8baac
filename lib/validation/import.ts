/**
 * The multipart fields of POST /api/sessions/[sessionId]/import besides `file`:
 * format, athleteColumn, testColumn, trialColumn, valueColumn, mapping (JSON), replace.
 * One schema for the route; the Import page sends exactly these field names.
 */
import { z } from "zod";
import "./zod-config";
import type { MappingRequest } from "@/lib/import/mapping";
import { IMPORT_FORMATS } from "@/lib/import/types";

const column = z.string().max(200, "Column names are limited to 200 characters.");

// Only a bound on what is parsed: a trial past the test's own limit is reported by the mapping
// step, which can name the column.
const wideTarget = z
  .object({ testId: z.number().int().positive(), trial: z.number().int().positive().max(99) })
  .nullable();

const wideMappingSchema = z
  .record(column, wideTarget)
  .refine((m) => Object.keys(m).length <= 500, "at most 500 columns.");

const matchKey = z.string().refine((key) => key.trim() !== "" && key.length <= 200, {
  message: "each name is 1 to 200 characters.",
});
const matchesSchema = z
  .object({
    athletes: z.record(matchKey, z.number().int().positive()).default({}),
    tests: z.record(matchKey, z.number().int().positive()).default({}),
    leaveOut: z
      .object({
        athletes: z.array(matchKey).max(500, "at most 500 names can be left out.").default([]),
        tests: z.array(matchKey).max(500, "at most 500 names can be left out.").default([]),
      })
      .optional(),
  })
  .refine((m) => Object.keys(m.athletes).length + Object.keys(m.tests).length <= 500, {
    message: "at most 500 names can be matched.",
  });

type Issue = { code: string; message: string; issues?: Issue[] };
/** The first of our own messages, also inside a record key's issues. */
function customIssue(issues: readonly Issue[]): Issue | undefined {
  for (const issue of issues) {
    if (issue.code === "custom") return issue;
    const inner = issue.issues && customIssue(issue.issues);
    if (inner) return inner;
  }
  return undefined;
}

/** A JSON text field, parsed and checked against `schema`; empty means not sent. */
const jsonField = <T>(name: string, schema: z.ZodType<T>, shape: string) =>
  z
    .string()
    .max(200_000, `${name} is limited to 200 000 characters.`)
    .optional()
    .transform((text, ctx): T | undefined => {
      if (text === undefined || text === "") return undefined;
      let parsed: unknown;
      try {
        parsed = JSON.parse(text);
      } catch {
        ctx.addIssue({ code: "custom", message: `${name} is not valid JSON.` });
        return z.NEVER;
      }
      const result = schema.safeParse(parsed);
      if (!result.success) {
        // Our own limits say what is wrong; anything else gets the expected shape.
        const own = customIssue(result.error.issues);
        ctx.addIssue({ code: "custom", message: own ? `${name}: ${own.message}` : `${name} ${shape}` });
        return z.NEVER;
      }
      return result.data;
    });

const yes = z
  .string()
  .optional()
  .transform((v) => v !== undefined && ["yes", "true", "1", "on"].includes(v.trim().toLowerCase()));

export const importOptionsSchema = z.object({
  mode: z.enum(["preview", "commit"], { message: "mode is preview or commit." }).default("preview"),
  format: z.enum(IMPORT_FORMATS, { message: "format is long or wide." }).optional(),
  athleteColumn: column.optional(),
  testColumn: column.optional(),
  /** An empty string says "no trial column": every row is trial 1. */
  trialColumn: column.optional(),
  valueColumn: column.optional(),
  mapping: jsonField("mapping", wideMappingSchema, "maps each column to { testId, trial } or null."),
  /** Names in the file read as a roster athlete or a battery test: { athletes: { name: id }, tests: { name: id } }. */
  matches: jsonField("matches", matchesSchema, "gives { athletes: { name: athleteId }, tests: { name: testId } }."),
  replace: yes,
  /** Keep the matches as other names of those athletes and tests, for the next import. */
  remember: yes,
});

export type ImportOptions = z.infer<typeof importOptionsSchema>;

/** The mapping the analysis uses, from the validated form fields (empty strings mean "not chosen"). */
export function mappingRequestOf(options: ImportOptions): MappingRequest {
  return {
    format: options.format,
    athleteColumn: options.athleteColumn || undefined,
    testColumn: options.testColumn || undefined,
    trialColumn: options.trialColumn,
    valueColumn: options.valueColumn || undefined,
    columns: options.mapping,
  };
}
