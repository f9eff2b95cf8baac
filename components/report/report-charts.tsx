"use client";

import dynamic from "next/dynamic";
import type { ChangeReportData } from "@/lib/client/queries";

// chart.js loads only on the pages that draw a chart, after the numbers are on screen.
const placeholder = (height: number) => () => (
  <div style={{ height }} className="animate-pulse rounded bg-paper" aria-hidden />
);
const ChangeLadder = dynamic(() => import("@/components/charts/change-ladder"), {
  ssr: false,
  loading: placeholder(300),
});
const PrePostLines = dynamic(() => import("@/components/charts/pre-post-lines"), {
  ssr: false,
  loading: placeholder(320),
});
const SquadInterval = dynamic(() => import("@/components/charts/squad-interval"), {
  ssr: false,
  loading: placeholder(130),
});

/**
 * A chart is drawn anew for each report: chart.js keeps its plugins (the SWC band) and dataset
 * layout from when it was created, so a changed test or SWC must not update the old drawing.
 */
const drawingKey = ({ test, sessions, settings, squad }: ChangeReportData) =>
  [test.id, sessions.from.id, sessions.to.id, settings.confidence, squad.swc].join(":");

export function SquadIntervalChart({ report }: { report: ChangeReportData }) {
  return <SquadInterval key={drawingKey(report)} report={report} />;
}

/** The Change ladder and the Pre–post lines, each with a line saying how to read it. */
export function AthleteCharts({ report }: { report: ChangeReportData }) {
  const withIntervals = report.test.typicalError !== null;
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <figure className="card p-4">
        <figcaption className="mb-2">
          <span className="font-bold">Change ladder</span>
          <span className="block text-sm text-ink-soft">
            Each athlete&apos;s change, best at the top
            {withIntervals ? ", with the interval from the test's typical error" : ""}. The shaded band is the smallest
            worthwhile change; ▶ gain, ◀ decline, ◆ steady, ✕ inconclusive.
          </span>
        </figcaption>
        <ChangeLadder key={drawingKey(report)} report={report} />
      </figure>
      <figure className="card p-4">
        <figcaption className="mb-2">
          <span className="font-bold">Pre–post lines</span>
          <span className="block text-sm text-ink-soft">
            One line per athlete between the two sessions; the heavy line is the squad mean.
          </span>
        </figcaption>
        <PrePostLines key={drawingKey(report)} report={report} />
      </figure>
    </div>
  );
}
