"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { LoadFailure } from "@/components/query-status";
import { changeReportSearch, reportQueries } from "@/lib/client/queries";
import { formatDate } from "@/lib/labels";
import type { ChangeReportQuery } from "@/lib/validation/reports";
import { AthleteChanges } from "./athlete-changes";
import { Interpretation } from "./interpretation";
import { AthleteCharts } from "./report-charts";
import { ReportSettings } from "./report-settings";
import { SquadPanel } from "./squad-panel";

/** The Change report: did the squad improve, and which athletes changed beyond the test's noise? */
export function ChangeReport({ initial, canWriteNote }: { initial: ChangeReportQuery; canWriteNote: boolean }) {
  const [query, setQuery] = useState(initial);
  const report = useQuery({ ...reportQueries.change(query), placeholderData: keepPreviousData });

  function change(next: ChangeReportQuery) {
    setQuery(next);
    // The URL holds the settings, so the report can be shared and reopened as it is.
    window.history.replaceState(null, "", `?${changeReportSearch(next)}`);
  }

  const data = report.data;
  return (
    <section aria-labelledby="report-heading" className="space-y-4 print:space-y-2 print:[zoom:0.62]">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 id="report-heading" className="text-2xl font-bold print:text-base">
            Change report
          </h1>
          <p className="text-ink-soft">
            {data ? (
              <>
                <span className="font-semibold text-ink">{data.test.name}</span> · {data.sessions.from.squadName}
                <span className="hidden print:inline">
                  {" "}
                  · {formatDate(data.sessions.from.date)} → {formatDate(data.sessions.to.date)}
                </span>
              </>
            ) : (
              "Pick a squad, two sessions and a test."
            )}
            {report.isFetching && <span role="status"> · updating…</span>}
          </p>
        </div>
        {data && (
          <div className="flex gap-2 print:hidden">
            <a className="btn-quiet" href={`/api/reports/change.csv?${changeReportSearch(query)}`} download>
              Download CSV
            </a>
            <button type="button" className="btn-quiet" onClick={() => window.print()}>
              Print
            </button>
          </div>
        )}
      </div>
      <div className="print:hidden">
        <ReportSettings query={query} unit={data?.test.unit ?? ""} onChange={change} />
      </div>
      {report.error && (
        <LoadFailure failure="This report cannot be drawn" error={report.error} onRetry={report.refetch} />
      )}
      {data && !report.error && (
        <>
          <SquadPanel report={data} />
          <div className="print:hidden">
            <AthleteCharts report={data} />
          </div>
          <AthleteChanges report={data} />
          <Interpretation query={query} squadId={data.sessions.from.squadId} canWrite={canWriteNote} />
        </>
      )}
      <p className="text-xs text-ink-soft">
        Results support training decisions; they are not a medical or return-to-play judgement — defer to your medical
        staff and licensed practitioners. Maximal tests carry injury risk: screen, warm up and supervise as your
        organisation&apos;s and governing body&apos;s protocols require. Athlete data is personal data: share reports
        only as your consent and data-protection rules allow.
      </p>
    </section>
  );
}
