"use client";

import type { ChartData, ChartOptions } from "chart.js";
import { Chart } from "react-chartjs-2";
import type { ChangeReportData } from "@/lib/client/queries";
import { signed } from "@/lib/words/report";
import { COLOURS, LYING, swcBand, verdictMark, verdictPoints } from "./chart-setup";

type Props = { report: ChangeReportData };

/** Change ladder: each athlete's change (better to the right) with its interval, sorted, the SWC band shaded. */
export default function ChangeLadder({ report }: Props) {
  const { test, squad } = report;
  const sign = test.direction === "higher" ? 1 : -1;
  const rows = [...report.athletes].sort((a, b) => b.betterChange - a.betterChange);
  const hasIntervals = rows.some((a) => a.ciLower !== null);
  const marks = rows.map((a) => verdictMark(a.verdict));
  // Intervals in the same "better to the right" orientation as the points.
  const bars = rows.map((a): [number, number] | null =>
    a.ciLower === null || a.ciUpper === null ? null : sign > 0 ? [a.ciLower, a.ciUpper] : [-a.ciUpper, -a.ciLower],
  );
  const data: ChartData<"bar" | "line", (number | [number, number] | null)[], string> = {
    labels: rows.map((a) => a.name),
    datasets: [
      ...(hasIntervals
        ? [
            {
              type: "bar" as const,
              label: "Interval",
              data: bars,
              backgroundColor: marks.map((m) => `${m.colour}55`),
              borderColor: marks.map((m) => m.colour),
              borderWidth: 1,
              barPercentage: 0.5,
            },
          ]
        : []),
      verdictPoints(
        "Observed change",
        rows.map((a) => a.betterChange),
        marks,
        6,
      ),
    ],
  };
  const options: ChartOptions<"bar" | "line"> = {
    ...LYING,
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          label: (item) => {
            const bar = bars[item.dataIndex];
            return item.dataset.label === "Interval" && bar
              ? `Interval ${signed(bar[0], test.decimals)} to ${signed(bar[1], test.decimals)} ${test.unit}`
              : `Change ${signed(rows[item.dataIndex].betterChange, test.decimals)} ${test.unit}`;
          },
        },
      },
    },
    scales: {
      x: {
        title: {
          display: true,
          text: `Change in ${test.unit} — ${test.direction === "higher" ? "higher" : "lower (faster)"} is to the right`,
        },
        grid: { color: COLOURS.grid },
      },
      y: { grid: { display: false }, ticks: { autoSkip: false } },
    },
  };
  return (
    <div style={{ height: 70 + rows.length * 26 }}>
      <Chart
        type="bar"
        data={data as ChartData<"bar", (number | [number, number] | null)[], string>}
        options={options as ChartOptions<"bar">}
        plugins={[swcBand<"bar">(squad.swc, "x")]}
        aria-label={`Change ladder of ${rows.length} athletes, sorted by change; the shaded band is the smallest worthwhile change of ${squad.swc.toFixed(test.decimals + 1)} ${test.unit}.`}
        role="img"
      />
    </div>
  );
}
