"use client";

import { SessionPairFields } from "@/components/report/session-pair-fields";
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
  return (
    <form className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-5" onSubmit={(e) => e.preventDefault()}>
      <SessionPairFields
        idPrefix="reliability"
        pair={{ first: query.firstSessionId, second: query.secondSessionId, testId: query.testId }}
        onSquad={(squadId, sessions) => {
          const pick = defaultReliabilityPair(sessions.filter((s) => s.squadId === squadId));
          if (pick) onChange({ ...query, ...pick });
        }}
        onChange={(pair) =>
          onChange({ ...query, firstSessionId: pair.first, secondSessionId: pair.second, testId: pair.testId })
        }
      />
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
