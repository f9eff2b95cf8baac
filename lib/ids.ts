/**
 * Record ids as they arrive in URLs (path segments and query strings). Only the canonical
 * spelling of a positive integer names a record: `Number()` would also turn "6.0", "6e0", "0x6",
 * " 6", "+6" and "06" into 6, so one record would answer to many URLs, and caches, logs and
 * audit trails would disagree about which record was asked for.
 */
const CANONICAL_ID = /^[1-9][0-9]{0,15}$/;

/** The id, or null when the text is not a canonical positive safe integer. */
export function canonicalId(value: string | null | undefined): number | null {
  if (typeof value !== "string" || !CANONICAL_ID.test(value)) return null;
  const id = Number(value);
  return Number.isSafeInteger(id) ? id : null;
}
