"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS } from "@/lib/labels";
import { defaultReliabilityPair } from "@/lib/reports/defaults";
import { RELIABILITY_CONFIDENCES, type ReliabilityQuery } from "@/lib/validation/reports";

/** What the Reliability check studies: squad, its two sessions, the test and the confidence level. */
export function ReliabilitySettings({
  query,
  onChange,
}: {
  query: ReliabilityQuery;
  onChange: (next: ReliabilityQuery) => void;
}) {
  const { data: sessions } = useSuspenseQuery(sessionQueries.list());
  const { data: squads } = useSuspenseQuery(squadQueries.list());
  const { data: tests } = useSuspenseQuery(testQueries.list({ archived: true }));
  const first = sessions.find((s) => s.id === query.firstSessionId);
  const second = sessions.find((s) => s.id === query.secondSessionId);
  const squadId = first?.squadId ?? second?.squadId ?? squads[0]?.id;
  const own = sessions.filter((s) => s.squadId === squadId).sort((a, b) => a.date.localeCompare(b.date) || a.id - b.id);
  const shared = tests.filter((t) => first?.testIds.includes(t.id) && second?.testIds.includes(t.id));
  const sessionLabel = (s: (typeof own)[number]) => `${formatDate(s.date)} · ${PHASE_LABELS[s.phase]}`;

  function chooseSquad(id: number) {
    const pick = defaultReliabilityPair(sessions.filter((s) => s.squadId === id));
    if (pick) onChange({ ...query, ...pick });
  }
  function chooseSession(side: "firstSessionId" | "secondSessionId", id: number) {
    const next = { ...query, [side]: id };
    const a = sessions.find((s) => s.id === next.firstSessionId);
    const b = sessions.find((s) => s.id === next.secondSessionId);
    // Keep the test if both sessions measured it, else the first test they share.
    const testIds = a && b ? a.testIds.filter((t) => b.testIds.includes(t)) : [];
    onChange({ ...next, testId: testIds.includes(query.testId) ? query.testId : (testIds[0] ?? query.testId) });
  }

  return (
    <form className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-5" onSubmit={(e) => e.preventDefault()}>
      <div>
        <label htmlFor="reliability-squad" className="text-sm font-semibold">
          Squad
        </label>
        <select
          id="reliability-squad"
          className="field mt-1"
          value={squadId ?? ""}
          onChange={(e) => chooseSquad(Number(e.target.value))}
        >
          {squads.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </div>
      {(["firstSessionId", "secondSessionId"] as const).map((side) => {
        const other = side === "firstSessionId" ? query.secondSessionId : query.firstSessionId;
        return (
          <div key={side}>
            <label htmlFor={`reliability-${side}`} className="text-sm font-semibold">
              {side === "firstSessionId" ? "First session" : "Second session"}
            </label>
            <select
              id={`reliability-${side}`}
              className="field mt-1"
              value={query[side]}
              onChange={(e) => chooseSession(side, Number(e.target.value))}
            >
              {own.map((s) => (
                <option key={s.id} value={s.id} disabled={s.id === other}>
                  {sessionLabel(s)}
                </option>
              ))}
            </select>
          </div>
        );
      })}
      <div>
        <label htmlFor="reliability-test" className="text-sm font-semibold">
          Test
        </label>
        <select
          id="reliability-test"
          className="field mt-1"
          value={query.testId}
          onChange={(e) => onChange({ ...query, testId: Number(e.target.value) })}
        >
          {shared.length === 0 && <option value={query.testId}>No test in both sessions</option>}
          {shared.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="reliability-confidence" className="text-sm font-semibold">
          Confidence
        </label>
        <select
          id="reliability-confidence"
          className="field mt-1"
          value={query.confidence}
          onChange={(e) => onChange({ ...query, confidence: Number(e.target.value) })}
        >
          {RELIABILITY_CONFIDENCES.map((c) => (
            <option key={c} value={c}>
              {Math.round(c * 100)} %
            </option>
          ))}
        </select>
      </div>
    </form>
  );
}
