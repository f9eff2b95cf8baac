"use client";

import type { ChartData, ChartOptions } from "chart.js";
import { Chart } from "react-chartjs-2";
import type { ChangeReportData } from "@/lib/client/queries";
import { confidenceWords, signed } from "@/lib/words/report";
import { COLOURS, LYING, ROUND_END_TICKS, swcBand, verdictMark, verdictPoints } from "./chart-setup";

/** Squad interval: the mean change with its t-interval, better to the right, against the SWC band. */
export default function SquadInterval({ report }: { report: ChangeReportData }) {
  const { test, squad, settings } = report;
  const sign = test.direction === "higher" ? 1 : -1;
  const bar: [number, number] = sign > 0 ? [squad.ciLower, squad.ciUpper] : [-squad.ciUpper, -squad.ciLower];
  const mark = verdictMark(squad.verdict);
  const reach = Math.max(Math.abs(bar[0]), Math.abs(bar[1]), squad.swc) * 1.25;
  const data: ChartData<"bar" | "line", (number | [number, number])[], string> = {
    labels: ["Squad"],
    datasets: [
      {
        type: "bar",
        label: "Interval",
        data: [bar],
        backgroundColor: `${mark.colour}55`,
        borderColor: mark.colour,
        borderWidth: 1.5,
        barPercentage: 0.45,
      },
      verdictPoints("Mean change", [sign * squad.meanDiff], [mark], 8),
    ],
  };
  const options: ChartOptions<"bar" | "line"> = {
    ...LYING,
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          label: (item) =>
            item.dataset.label === "Interval"
              ? `${confidenceWords(settings.confidence)} interval ${signed(bar[0], test.decimals + 1)} to ${signed(bar[1], test.decimals + 1)} ${test.unit}`
              : `Mean change ${signed(sign * squad.meanDiff, test.decimals + 1)} ${test.unit}`,
        },
      },
    },
    scales: {
      x: {
        min: -reach,
        max: reach,
        ticks: ROUND_END_TICKS,
        title: { display: true, text: `Change in ${test.unit}, better to the right` },
        grid: { color: COLOURS.grid },
      },
      y: { grid: { display: false } },
    },
  };
  return (
    <div style={{ height: 130 }}>
      <Chart
        type="bar"
        data={data as ChartData<"bar", (number | [number, number])[], string>}
        options={options as ChartOptions<"bar">}
        plugins={[swcBand<"bar">(squad.swc, "x")]}
        role="img"
        aria-label={`Squad interval: mean change ${signed(sign * squad.meanDiff, test.decimals + 1)} ${test.unit}, ${confidenceWords(settings.confidence)} interval ${signed(bar[0], test.decimals + 1)} to ${signed(bar[1], test.decimals + 1)}, smallest worthwhile change ${squad.swc.toFixed(test.decimals + 1)} ${test.unit}.`}
      />
    </div>
  );
}
