"use client";

import { REPORT_CONFIDENCES, SWC_METHODS, type SwcMethod } from "@/lib/domain";
import { defaultComparison } from "@/lib/reports/defaults";
import type { ChangeReportQuery } from "@/lib/validation/reports";
import { SessionPairFields } from "./session-pair-fields";

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
  function chooseSwc(method: SwcMethod | "") {
    if (method === "") onChange({ ...query, swcMethod: undefined, swcValue: undefined });
    else onChange({ ...query, swcMethod: method, swcValue: SWC_CHOICES[method].defaultValue });
  }

  return (
    <form className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
      <SessionPairFields
        idPrefix="report"
        pair={{ first: query.fromSessionId, second: query.toSessionId, testId: query.testId }}
        onSquad={(squadId, sessions) => {
          const pick = defaultComparison(sessions, squadId);
          if (pick) onChange({ ...query, ...pick });
        }}
        onChange={(pair) =>
          onChange({ ...query, fromSessionId: pair.first, toSessionId: pair.second, testId: pair.testId })
        }
      />
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
