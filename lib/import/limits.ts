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

/**
 * Columns read from a file. A battery's tests × trials plus the usual ride-along columns fit in
 * far fewer, and the mapping step takes at most 500 columns; it also bounds the work and the
 * answer for a file of 100 000 columns.
 */
export const MAX_IMPORT_COLUMNS = 500;

/** A column name longer than this is not a name (the mapping step takes 200 characters). */
export const MAX_HEADER_CHARS = 200;

/** Cell text shown back in a preview or a message; the rest is elided. */
export const MAX_SHOWN_CHARS = 200;
