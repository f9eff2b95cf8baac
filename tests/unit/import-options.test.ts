import { describe, expect, it } from "vitest";
import { importOptionsSchema, mappingRequestOf } from "@/lib/validation/import";

describe("importOptionsSchema (the multipart fields besides the file)", () => {
  it("defaults to a preview and never replaces unless told", () => {
    expect(importOptionsSchema.parse({})).toMatchObject({ mode: "preview", replace: false });
    for (const yes of ["yes", "YES", "true", "1", "on"])
      expect(importOptionsSchema.parse({ replace: yes }).replace).toBe(true);
    for (const no of ["no", "", "false", "0", "maybe"])
      expect(importOptionsSchema.parse({ replace: no }).replace).toBe(false);
  });

  it("reads the wide mapping as JSON: column → { testId, trial } or null", () => {
    const options = importOptionsSchema.parse({
      mode: "commit",
      format: "wide",
      athleteColumn: "Player",
      mapping: '{"CMJ a":{"testId":3,"trial":2},"Notes":null}',
    });
    expect(mappingRequestOf(options)).toEqual({
      format: "wide",
      athleteColumn: "Player",
      testColumn: undefined,
      trialColumn: undefined,
      valueColumn: undefined,
      columns: { "CMJ a": { testId: 3, trial: 2 }, Notes: null },
    });
  });

  it("refuses a bad mode, format or mapping with a message", () => {
    const message = (input: Record<string, string>) => {
      const result = importOptionsSchema.safeParse(input);
      expect(result.success).toBe(false);
      return result.error!.issues[0].message;
    };
    expect(message({ mode: "publish" })).toMatch(/preview or commit/);
    expect(message({ format: "tall" })).toMatch(/long or wide/);
    expect(message({ mapping: "{not json" })).toMatch(/not valid JSON/);
    expect(message({ mapping: '{"a":{"testId":"x","trial":1}}' })).toMatch(/testId, trial/);
  });

  it("an empty trialColumn means the file has no trial column", () => {
    expect(mappingRequestOf(importOptionsSchema.parse({ format: "long", trialColumn: "" })).trialColumn).toBe("");
  });
});
