import "server-only";

/** True when the database refused a write because of a UNIQUE constraint. */
export function isUniqueViolation(error: unknown): boolean {
  for (let e: unknown = error; e; e = (e as { cause?: unknown }).cause) {
    const message = e instanceof Error ? e.message : String(e);
    if (message.includes("UNIQUE constraint failed")) return true;
  }
  return false;
}
