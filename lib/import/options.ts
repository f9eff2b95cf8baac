import type { ImportOptions } from "@/lib/validation/import";
import type { MappingRequest } from "./mapping";

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
