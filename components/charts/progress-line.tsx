"use client";

import type { ChartData, ChartOptions, Plugin } from "chart.js";
import { Chart } from "react-chartjs-2";
import type { AthleteHistoryData } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS } from "@/lib/labels";
import { COLOURS, verdictMark, verdictPoints } from "./chart-setup";

type Test = Pick<
  AthleteHistoryData["tests"][number],
  "name" | "unit" | "decimals" | "direction" | "typicalError" | "scores"
>;

/**
 * The SWC band around the latest change: [previous − SWC, previous + SWC] over the step from the
 * previous score to the latest one, dashed, so a latest score outside it moved by more than the
 * smallest change that matters.
 */
function swcAroundLatest(around: number, swc: number): Plugin<"bar"> {
  return {
    id: "swcAroundLatest",
    beforeDatasetsDraw(chart) {
      const { ctx, chartArea: area, scales } = chart;
      const x = scales.x;
      const y = scales.y;
      const n = chart.data.labels?.length ?? 0;
      if (!x || !y || !area || n < 2) return;
      const left = x.getPixelForValue(n - 2);
      const right = x.getPixelForValue(n - 1);
      const top = y.getPixelForValue(around + swc);
      const bottom = y.getPixelForValue(around - swc);
      ctx.save();
      ctx.fillStyle = "rgba(243, 233, 216, 0.9)";
      ctx.fillRect(left, top, right - left, bottom - top);
      ctx.setLineDash([5, 4]);
      ctx.strokeStyle = COLOURS.ink;
      ctx.lineWidth = 1;
      ctx.strokeRect(left, top, right - left, bottom - top);
      ctx.restore();
    },
  };
}

/**
 * Progress line: one athlete's scores in one test over time. When the test's typical error is
 * known, each score carries its noise band (score ± TE), so a step that stays inside the bands
 * reads as noise at a glance. Points are shaped by the verdict of the change that led to them.
 */
export default function ProgressLine({ test, swcBand }: { test: Test; swcBand?: { around: number; swc: number } }) {
  const points = test.scores.filter((s) => s.value !== null && s.flag === null);
  const te = test.typicalError;
  const labels = points.map((s) => formatDate(s.date));
  const marks = points.map((s) => verdictMark(s.verdict));
  const data: ChartData<"bar" | "line", (number | [number, number] | null)[], string> = {
    labels,
    datasets: [
      ...(te !== null
        ? [
            {
              type: "bar" as const,
              label: "Noise band (± typical error)",
              data: points.map((s): [number, number] => [s.value! - te, s.value! + te]),
              backgroundColor: COLOURS.band,
              borderColor: "#C9B48F",
              borderWidth: 1,
              barPercentage: 0.35,
              maxBarThickness: 28,
              // Behind the scores: a higher order is drawn first.
              order: 2,
            },
          ]
        : []),
      {
        ...verdictPoints(
          "Score",
          points.map((s) => s.value!),
          marks,
          5,
        ),
        showLine: true,
        borderColor: COLOURS.ink,
        borderWidth: 2,
        order: 1,
      },
    ],
  };
  const options: ChartOptions<"bar" | "line"> = {
    responsive: true,
    maintainAspectRatio: false,
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          title: (items) => {
            const s = points[items[0]?.dataIndex ?? 0];
            return s ? `${formatDate(s.date)} · ${PHASE_LABELS[s.phase]}` : "";
          },
          label: (item) => {
            const s = points[item.dataIndex];
            if (item.dataset.label === "Score") return `Score ${s.value!.toFixed(test.decimals)} ${test.unit}`;
            return `Noise band ${(s.value! - te!).toFixed(test.decimals)} to ${(s.value! + te!).toFixed(test.decimals)} ${test.unit}`;
          },
        },
      },
    },
    scales: {
      y: {
        // The SWC band must fit on the axis too, or its edges would be cut off.
        ...(swcBand ? { suggestedMin: swcBand.around - swcBand.swc, suggestedMax: swcBand.around + swcBand.swc } : {}),
        // A bar chart starts its axis at zero; scores do not, and a change would flatten out.
        beginAtZero: false,
        grace: "10%",
        // No tick finer than the test records its scores in.
        ticks: { precision: test.decimals },
        title: { display: true, text: `${test.unit} — ${test.direction === "higher" ? "higher" : "lower"} is better` },
        grid: { color: COLOURS.grid },
      },
      x: { grid: { display: false } },
    },
  };
  const first = points[0];
  const last = points[points.length - 1];
  return (
    <div style={{ height: 240 }}>
      <Chart
        type="bar"
        data={data as ChartData<"bar", (number | [number, number] | null)[], string>}
        options={options as ChartOptions<"bar">}
        plugins={swcBand ? [swcAroundLatest(swcBand.around, swcBand.swc)] : []}
        role="img"
        aria-label={
          first && last
            ? `Progress line of ${test.name}: ${points.length} scores from ${first.value!.toFixed(test.decimals)} ${test.unit} on ${formatDate(first.date)} to ${last.value!.toFixed(test.decimals)} ${test.unit} on ${formatDate(last.date)}${te !== null ? `, each with a noise band of ± ${te} ${test.unit}` : ""}${swcBand ? `; the smallest change that matters, ± ${swcBand.swc.toFixed(test.decimals)} ${test.unit}, is shaded around the previous score` : ""}.`
            : `Progress line of ${test.name}: no usable scores.`
        }
      />
    </div>
  );
}
