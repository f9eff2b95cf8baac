"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS } from "@/lib/labels";
import { keptTest, pairSquad, sharedTestIds, squadSessions } from "@/lib/reports/session-pair";

export type SessionPair = { first: number; second: number; testId: number };

/**
 * Squad, first and second session, and test: the fields the Change report and the Reliability
 * check share, inside the caller's form grid. Choosing a squad asks the caller for its default
 * pair; choosing a session keeps the test where both sessions measured it.
 */
export function SessionPairFields({
  idPrefix,
  pair,
  onSquad,
  onChange,
}: {
  idPrefix: string;
  pair: SessionPair;
  onSquad: (squadId: number, sessions: ReturnType<typeof useSessions>) => void;
  onChange: (next: SessionPair) => void;
}) {
  const sessions = useSessions();
  const { data: squads } = useSuspenseQuery(squadQueries.list());
  const { data: tests } = useSuspenseQuery(testQueries.list({ archived: true }));
  const squadId = pairSquad(sessions, pair.first, pair.second, squads[0]?.id);
  const own = squadSessions(sessions, squadId);
  const shared = sharedTestIds(sessions, pair.first, pair.second);
  const sharedTests = tests.filter((t) => shared.includes(t.id));

  function chooseSession(side: "first" | "second", id: number) {
    const next = { ...pair, [side]: id };
    onChange({ ...next, testId: keptTest(sessions, next.first, next.second, pair.testId) });
  }

  return (
    <>
      <div>
        <label htmlFor={`${idPrefix}-squad`} className="text-sm font-semibold">
          Squad
        </label>
        <select
          id={`${idPrefix}-squad`}
          className="field mt-1"
          value={squadId ?? ""}
          onChange={(e) => onSquad(Number(e.target.value), sessions)}
        >
          {squads.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </div>
      {(["first", "second"] as const).map((side) => (
        <div key={side}>
          <label htmlFor={`${idPrefix}-${side}-session`} className="text-sm font-semibold">
            {side === "first" ? "First session" : "Second session"}
          </label>
          <select
            id={`${idPrefix}-${side}-session`}
            className="field mt-1"
            value={pair[side]}
            onChange={(e) => chooseSession(side, Number(e.target.value))}
          >
            {own.map((s) => (
              <option key={s.id} value={s.id} disabled={s.id === pair[side === "first" ? "second" : "first"]}>
                {formatDate(s.date)} · {PHASE_LABELS[s.phase]}
              </option>
            ))}
          </select>
        </div>
      ))}
      <div>
        <label htmlFor={`${idPrefix}-test`} className="text-sm font-semibold">
          Test
        </label>
        <select
          id={`${idPrefix}-test`}
          className="field mt-1"
          value={pair.testId}
          onChange={(e) => onChange({ ...pair, testId: Number(e.target.value) })}
        >
          {sharedTests.length === 0 && <option value={pair.testId}>No test in both sessions</option>}
          {sharedTests.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </select>
      </div>
    </>
  );
}

function useSessions() {
  return useSuspenseQuery(sessionQueries.list()).data;
}
