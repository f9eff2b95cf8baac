import type { Phase } from "@/lib/domain";

type SessionChoice = { id: number; squadId: number; date: string; phase: Phase; testIds: number[] };

/**
 * The pair a Change report opens on when the link names none: the squad's latest post-block
 * session and the latest pre-block (else baseline) session before it, else its two latest
 * sessions; the first test both measured. Null when the squad has no two sessions sharing a test.
 */
export function defaultComparison(sessions: SessionChoice[], squadId: number) {
  const own = sessions.filter((s) => s.squadId === squadId).sort((a, b) => b.date.localeCompare(a.date) || b.id - a.id);
  const shares = (a: SessionChoice, b: SessionChoice) => a.testIds.some((t) => b.testIds.includes(t));
  const before = (to: SessionChoice, phases: Phase[]) =>
    own.find((s) => s.id !== to.id && s.date <= to.date && phases.includes(s.phase) && shares(s, to));
  const pairs: [SessionChoice | undefined, SessionChoice | undefined][] = [];
  for (const to of own.filter((s) => s.phase === "post-block"))
    pairs.push([before(to, ["pre-block"]) ?? before(to, ["baseline"]), to]);
  for (const to of own) pairs.push([own.find((s) => s.id !== to.id && s.date <= to.date && shares(s, to)), to]);
  const found = pairs.find((p): p is [SessionChoice, SessionChoice] => p[0] !== undefined && p[1] !== undefined);
  if (!found) return null;
  const [from, to] = found;
  return { fromSessionId: from.id, toSessionId: to.id, testId: from.testIds.find((t) => to.testIds.includes(t))! };
}

/**
 * The pair a Reliability check opens on when the link names none: the latest retest session in
 * reach and the latest baseline of the same squad on or before it that shares a test with it,
 * else any two sessions of one squad that share a test (the latest); the first test both
 * measured. Null when no squad has two sessions sharing a test.
 */
export function defaultReliabilityPair(sessions: SessionChoice[]) {
  const newest = [...sessions].sort((a, b) => b.date.localeCompare(a.date) || b.id - a.id);
  const shares = (a: SessionChoice, b: SessionChoice) => a.testIds.some((t) => b.testIds.includes(t));
  const earlier = (second: SessionChoice, phases?: Phase[]) =>
    newest.find(
      (s) =>
        s.id !== second.id &&
        s.squadId === second.squadId &&
        s.date <= second.date &&
        (!phases || phases.includes(s.phase)) &&
        shares(s, second),
    );
  const pairs: [SessionChoice | undefined, SessionChoice][] = [
    ...newest
      .filter((s) => s.phase === "retest")
      .map((s): [SessionChoice | undefined, SessionChoice] => [earlier(s, ["baseline"]), s]),
    ...newest.map((s): [SessionChoice | undefined, SessionChoice] => [earlier(s), s]),
  ];
  const found = pairs.find((p): p is [SessionChoice, SessionChoice] => p[0] !== undefined);
  if (!found) return null;
  const [first, second] = found;
  return {
    firstSessionId: first.id,
    secondSessionId: second.id,
    testId: first.testIds.find((t) => second.testIds.includes(t))!,
  };
}
