"use client";

import type { ChartData, ChartOptions } from "chart.js";
import { Scatter } from "react-chartjs-2";
import type { ReliabilityStudy } from "@/lib/client/queries";
import { plain, signed } from "@/lib/words/report";
import { COLOURS, ROUND_END_TICKS } from "./chart-setup";

type Point = { x: number; y: number };

/**
 * Differences against means (Bland & Altman 1986): each athlete's second minus first score
 * against the mean of the two, with the change in mean and the 95 % limits of agreement.
 */
export default function AgreementPlot({ report }: { report: ReliabilityStudy }) {
  const { test, pairs, changeInMean, limitsOfAgreement } = report;
  const d = test.decimals + 1;
  const points = pairs.map((p) => ({ x: (p.first + p.second) / 2, y: p.second - p.first }));
  const xs = points.map((p) => p.x);
  const span = Math.max(...xs) - Math.min(...xs) || Math.abs(xs[0]) * 0.05 || 1;
  const from = Math.min(...xs) - span * 0.05;
  const to = Math.max(...xs) + span * 0.05;
  const across = (y: number): Point[] => [
    { x: from, y },
    { x: to, y },
  ];
  const line = (label: string, y: number, dash: number[]) => ({
    label,
    data: across(y),
    showLine: true,
    borderColor: COLOURS.ink,
    borderDash: dash,
    borderWidth: 1.5,
    pointRadius: 0,
    pointHitRadius: 0,
  });
  const data: ChartData<"scatter", Point[]> = {
    datasets: [
      {
        label: "Athlete",
        data: points,
        pointRadius: 5,
        pointStyle: "circle",
        pointBackgroundColor: COLOURS.gain,
        pointBorderColor: COLOURS.ink,
      },
      line("Change in mean", changeInMean, []),
      line("Lower limit of agreement", limitsOfAgreement.lower, [6, 4]),
      line("Upper limit of agreement", limitsOfAgreement.upper, [6, 4]),
    ],
  };
  const options: ChartOptions<"scatter"> = {
    responsive: true,
    maintainAspectRatio: false,
    plugins: {
      legend: { display: false },
      tooltip: {
        filter: (item) => item.datasetIndex === 0,
        callbacks: {
          label: (item) =>
            `${pairs[item.dataIndex].name}: mean ${plain(points[item.dataIndex].x, d)}, difference ${signed(points[item.dataIndex].y, d)} ${test.unit}`,
        },
      },
    },
    scales: {
      x: {
        type: "linear",
        min: from,
        max: to,
        ticks: ROUND_END_TICKS,
        title: { display: true, text: `Mean of the two ${report.file ? "trials" : "sessions"} (${test.unit})` },
        grid: { color: COLOURS.grid },
      },
      y: {
        title: { display: true, text: `Second − first (${test.unit})` },
        grid: { color: COLOURS.grid },
      },
    },
  };
  return (
    <div style={{ height: 300 }}>
      <Scatter
        data={data}
        options={options}
        role="img"
        aria-label={`Differences against means for ${pairs.length} athletes: change in mean ${signed(changeInMean, d)} ${test.unit}, limits of agreement ${signed(limitsOfAgreement.lower, d)} to ${signed(limitsOfAgreement.upper, d)} ${test.unit}.`}
      />
    </div>
  );
}
