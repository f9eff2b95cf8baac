"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { LoadFailure } from "@/components/query-status";
import { changeReportSearch, reportQueries } from "@/lib/client/queries";
import type { ChangeReportQuery } from "@/lib/validation/reports";
import { AthleteChanges } from "./athlete-changes";
import { AthleteCharts } from "./report-charts";
import { ReportSettings } from "./report-settings";
import { SquadPanel } from "./squad-panel";

/** The Change report: did the squad improve, and which athletes changed beyond the test's noise? */
export function ChangeReport({ initial }: { initial: ChangeReportQuery }) {
  const [query, setQuery] = useState(initial);
  const report = useQuery({ ...reportQueries.change(query), placeholderData: keepPreviousData });

  function change(next: ChangeReportQuery) {
    setQuery(next);
    // The URL holds the settings, so the report can be shared and reopened as it is.
    window.history.replaceState(null, "", `?${changeReportSearch(next)}`);
  }

  const data = report.data;
  return (
    <section aria-labelledby="report-heading" className="space-y-4">
      <div>
        <h1 id="report-heading" className="text-2xl font-bold">
          Change report
        </h1>
        <p className="text-ink-soft">
          {data ? (
            <>
              <span className="font-semibold text-ink">{data.test.name}</span> · {data.sessions.from.squadName}
            </>
          ) : (
            "Pick a squad, two sessions and a test."
          )}
          {report.isFetching && <span role="status"> · updating…</span>}
        </p>
      </div>
      <ReportSettings query={query} unit={data?.test.unit ?? ""} onChange={change} />
      {report.error && (
        <LoadFailure failure="This report cannot be drawn" error={report.error} onRetry={report.refetch} />
      )}
      {data && !report.error && (
        <>
          <SquadPanel report={data} />
          <AthleteCharts report={data} />
          <AthleteChanges report={data} />
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
