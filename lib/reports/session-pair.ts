/**
 * Two sessions of one squad compared on one test: what the Change report and the Reliability
 * check both let the user pick. One rule for which sessions are offered and which test is kept.
 */

export type PairableSession = { id: number; squadId: number; date: string; testIds: number[] };

/**
 * The squad the pair belongs to: the first session's, else the second's, else `fallback`.
 * @example pairSquad(sessions, 4, 9, 1) // the squad of session 4
 */
export function pairSquad(
  sessions: readonly PairableSession[],
  firstId: number,
  secondId: number,
  fallback: number | undefined,
): number | undefined {
  const byId = (id: number) => sessions.find((s) => s.id === id);
  return byId(firstId)?.squadId ?? byId(secondId)?.squadId ?? fallback;
}

/** One squad's sessions, oldest first (the same day: created first). */
export const squadSessions = <T extends PairableSession>(sessions: readonly T[], squadId: number | undefined): T[] =>
  sessions.filter((s) => s.squadId === squadId).sort((a, b) => a.date.localeCompare(b.date) || a.id - b.id);

/**
 * The tests both sessions measured, in the first session's order; none when either is unknown.
 * @example sharedTestIds(sessions, 4, 9) // [2, 5]
 */
export function sharedTestIds(sessions: readonly PairableSession[], firstId: number, secondId: number): number[] {
  const a = sessions.find((s) => s.id === firstId);
  const b = sessions.find((s) => s.id === secondId);
  return a && b ? a.testIds.filter((t) => b.testIds.includes(t)) : [];
}

/**
 * The test to show after a session changes: the same one if both sessions measured it, else the
 * first test they share, else (nothing shared) the same one, which the report then explains.
 */
export function keptTest(sessions: readonly PairableSession[], firstId: number, secondId: number, testId: number) {
  const shared = sharedTestIds(sessions, firstId, secondId);
  return shared.includes(testId) ? testId : (shared[0] ?? testId);
}
