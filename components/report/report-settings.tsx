"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { REPORT_CONFIDENCES, SWC_METHODS, type SwcMethod } from "@/lib/domain";
import { formatDate, PHASE_LABELS } from "@/lib/labels";
import { defaultComparison } from "@/lib/reports/defaults";
import type { ChangeReportQuery } from "@/lib/validation/reports";

const SWC_CHOICES: Record<SwcMethod, { label: string; defaultValue: number; unitLabel: (unit: string) => string }> = {
  "sd-factor": { label: "Factor × between-athlete SD", defaultValue: 0.2, unitLabel: () => "factor" },
  fixed: { label: "Fixed value", defaultValue: 0, unitLabel: (unit) => unit },
  "cv-factor": { label: "Factor × CV%", defaultValue: 0.3, unitLabel: () => "factor" },
};

/**
 * What the report compares: squad, the two sessions, the test, confidence and the SWC. Every
 * choice goes straight into the URL, so the report can be shared as a link and reopened.
 */
export function ReportSettings({
  query,
  unit,
  onChange,
}: {
  query: ChangeReportQuery;
  unit: string;
  onChange: (next: ChangeReportQuery) => void;
}) {
  const { data: sessions } = useSuspenseQuery(sessionQueries.list());
  const { data: squads } = useSuspenseQuery(squadQueries.list());
  const { data: tests } = useSuspenseQuery(testQueries.list({ archived: true }));
  const from = sessions.find((s) => s.id === query.fromSessionId);
  const to = sessions.find((s) => s.id === query.toSessionId);
  const squadId = from?.squadId ?? to?.squadId ?? squads[0]?.id;
  const own = sessions.filter((s) => s.squadId === squadId).sort((a, b) => a.date.localeCompare(b.date) || a.id - b.id);
  const shared = tests.filter((t) => from?.testIds.includes(t.id) && to?.testIds.includes(t.id));
  const sessionLabel = (s: (typeof own)[number]) => `${formatDate(s.date)} · ${PHASE_LABELS[s.phase]}`;

  function chooseSquad(id: number) {
    const pick = defaultComparison(sessions, id);
    if (pick) onChange({ ...query, ...pick });
  }
  function chooseSession(side: "fromSessionId" | "toSessionId", id: number) {
    const next = { ...query, [side]: id };
    const a = sessions.find((s) => s.id === next.fromSessionId);
    const b = sessions.find((s) => s.id === next.toSessionId);
    // Keep the test if both sessions measured it, else the first test they share.
    const testIds = a && b ? a.testIds.filter((t) => b.testIds.includes(t)) : [];
    onChange({ ...next, testId: testIds.includes(query.testId) ? query.testId : (testIds[0] ?? query.testId) });
  }
  function chooseSwc(method: SwcMethod | "") {
    if (method === "") onChange({ ...query, swcMethod: undefined, swcValue: undefined });
    else onChange({ ...query, swcMethod: method, swcValue: SWC_CHOICES[method].defaultValue });
  }

  return (
    <form className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
      <div>
        <label htmlFor="report-squad" className="text-sm font-semibold">
          Squad
        </label>
        <select
          id="report-squad"
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
      <div>
        <label htmlFor="report-first-session" className="text-sm font-semibold">
          First session
        </label>
        <select
          id="report-first-session"
          className="field mt-1"
          value={query.fromSessionId}
          onChange={(e) => chooseSession("fromSessionId", Number(e.target.value))}
        >
          {own.map((s) => (
            <option key={s.id} value={s.id} disabled={s.id === query.toSessionId}>
              {sessionLabel(s)}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="report-second-session" className="text-sm font-semibold">
          Second session
        </label>
        <select
          id="report-second-session"
          className="field mt-1"
          value={query.toSessionId}
          onChange={(e) => chooseSession("toSessionId", Number(e.target.value))}
        >
          {own.map((s) => (
            <option key={s.id} value={s.id} disabled={s.id === query.fromSessionId}>
              {sessionLabel(s)}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="report-test" className="text-sm font-semibold">
          Test
        </label>
        <select
          id="report-test"
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
        <label htmlFor="report-confidence" className="text-sm font-semibold">
          Confidence
        </label>
        <select
          id="report-confidence"
          className="field mt-1"
          value={query.confidence}
          onChange={(e) => onChange({ ...query, confidence: Number(e.target.value) })}
        >
          {REPORT_CONFIDENCES.map((c) => (
            <option key={c} value={c}>
              {Math.round(c * 100)} %
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="report-smallest-worthwhile-change" className="text-sm font-semibold">
          Smallest worthwhile change
        </label>
        <select
          id="report-smallest-worthwhile-change"
          className="field mt-1"
          value={query.swcMethod ?? ""}
          onChange={(e) => chooseSwc(e.target.value as SwcMethod | "")}
        >
          <option value="">The test&apos;s own method</option>
          {SWC_METHODS.map((m) => (
            <option key={m} value={m}>
              {SWC_CHOICES[m].label}
            </option>
          ))}
        </select>
      </div>
      {query.swcMethod && (
        <div>
          <label htmlFor="report-swc-value" className="text-sm font-semibold">
            SWC {SWC_CHOICES[query.swcMethod].unitLabel(unit)}
          </label>
          <input
            id="report-swc-value"
            className="field num mt-1"
            type="number"
            min={0}
            step="any"
            inputMode="decimal"
            defaultValue={query.swcValue}
            key={`${query.swcMethod}-${query.swcValue}`}
            onBlur={(e) => {
              const value = Number(e.target.value);
              if (Number.isFinite(value) && value >= 0 && value !== query.swcValue)
                onChange({ ...query, swcValue: value });
            }}
          />
        </div>
      )}
    </form>
  );
}
