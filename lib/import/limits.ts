/** Import limits, shared by the route handler, the Import page and the tests. */
export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;

/** Multipart framing (boundaries, part headers, the mapping fields) on top of the file itself. */
export const MULTIPART_ALLOWANCE_BYTES = 256 * 1024;

export const TOO_LARGE_MESSAGE =
  "The file is larger than 10 MB. Split it (for example one file per test) and import the parts one after another.";

/** Rows shown in the preview table. */
export const PREVIEW_ROWS = 20;

/** Row errors listed in one answer; the total is always given, so a broken 100 000-row file stays readable. */
export const MAX_LISTED_ERRORS = 200;

/** Replaced values listed in a preview or a 409 answer. */
export const MAX_LISTED_REPLACEMENTS = 200;
