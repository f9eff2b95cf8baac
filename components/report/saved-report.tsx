"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Breadcrumbs } from "@/components/breadcrumbs";
import { changeReportSearch, reportQueries } from "@/lib/client/queries";
import { formatDate } from "@/lib/labels";
import { AthleteChanges } from "./athlete-changes";
import { AthleteCharts } from "./report-charts";
import { SquadPanel } from "./squad-panel";

/** A Change report exactly as it was saved, with the scientist's note. */
export function SavedReport({ reportId }: { reportId: number }) {
  const { data: saved } = useSuspenseQuery(reportQueries.savedOne(reportId));
  const report = saved.snapshot;
  const savedOn = formatDate(new Date(saved.createdAt).toISOString().slice(0, 10));
  return (
    <section aria-labelledby="saved-heading" className="space-y-4 print:space-y-2 print:[zoom:0.62]">
      <Breadcrumbs
        trail={[
          { href: `/reports/change?${changeReportSearch(saved.settings)}`, label: "Change report" },
          { label: "Saved report" },
        ]}
      />
      <div>
        <h1 id="saved-heading" className="text-2xl font-bold print:text-base">
          {report.test.name} · {report.sessions.from.squadName}
        </h1>
        <p className="text-ink-soft">
          {formatDate(report.sessions.from.date)} → {formatDate(report.sessions.to.date)} · saved {savedOn}
          {saved.authorName ? ` by ${saved.authorName}` : ""}
        </p>
      </div>
      {saved.changedSince && (
        <p role="status" className="rounded-md border border-decline bg-decline-soft px-3 py-2 text-sm">
          Scores or the test&apos;s settings have changed since this report was saved. It shows the figures as they
          were;{" "}
          <Link href={`/reports/change?${changeReportSearch(saved.settings)}`} className="font-semibold underline">
            open the live report
          </Link>{" "}
          for today&apos;s.
        </p>
      )}
      <section aria-labelledby="note-heading" className="card p-4">
        <h2 id="note-heading" className="font-bold">
          Interpretation
        </h2>
        <p className="mt-1 whitespace-pre-line">{saved.note}</p>
      </section>
      <SquadPanel report={report} />
      <div className="print:hidden">
        <AthleteCharts report={report} />
      </div>
      <AthleteChanges report={report} />
      <p className="text-xs text-ink-soft">
        Results support training decisions; they are not a medical or return-to-play judgement — defer to your medical
        staff and licensed practitioners. Athlete data is personal data: share reports only as your consent and
        data-protection rules allow.
      </p>
    </section>
  );
}
