"use client";

import type { ChartData, ChartOptions } from "chart.js";
import { Line } from "react-chartjs-2";
import type { ChangeReportData } from "@/lib/client/queries";
import { formatDate } from "@/lib/labels";
import { COLOURS, verdictMark } from "./chart-setup";

/** Pre–post lines: one line per athlete from the first session to the second, the squad mean drawn heavier. */
export default function PrePostLines({ report }: { report: ChangeReportData }) {
  const { test, squad, sessions } = report;
  const labels = [formatDate(sessions.from.date), formatDate(sessions.to.date)];
  const data: ChartData<"line", number[], string> = {
    labels,
    datasets: [
      ...report.athletes.map((a) => {
        const mark = verdictMark(a.verdict);
        return {
          label: a.name,
          data: [a.pre, a.post],
          borderColor: a.verdict ? `${mark.colour}99` : "#58617699",
          backgroundColor: a.verdict ? mark.colour : "#586176",
          borderWidth: 1.5,
          pointRadius: 3,
        };
      }),
      {
        label: "Squad mean",
        data: [squad.meanPre, squad.meanPost],
        borderColor: COLOURS.ink,
        backgroundColor: COLOURS.ink,
        borderWidth: 4,
        pointRadius: 5,
      },
    ],
  };
  const options: ChartOptions<"line"> = {
    responsive: true,
    maintainAspectRatio: false,
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          label: (item) => `${item.dataset.label}: ${Number(item.raw).toFixed(test.decimals)} ${test.unit}`,
        },
      },
    },
    scales: {
      y: {
        title: {
          display: true,
          text: `${test.name} (${test.unit}) — ${test.direction === "higher" ? "higher" : "lower"} is better`,
        },
        grid: { color: COLOURS.grid },
      },
      x: { grid: { display: false }, offset: true },
    },
  };
  return (
    <div style={{ height: 320 }}>
      <Line
        data={data}
        options={options}
        role="img"
        aria-label={`Pre–post lines: ${report.athletes.length} athletes from ${labels[0]} to ${labels[1]}; squad mean ${squad.meanPre.toFixed(test.decimals + 1)} to ${squad.meanPost.toFixed(test.decimals + 1)} ${test.unit}.`}
      />
    </div>
  );
}
