/**
 * chart.js for our charts only: the pieces they draw with (tree-shaken), Barlow as the font,
 * the product's colours, and the SWC band drawn behind the data.
 */
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart,
  type ChartType,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  type Plugin,
  PointElement,
  type Scale,
  ScatterController,
  type Tick,
  Tooltip,
} from "chart.js";
import type { Verdict } from "@/lib/stats";

Chart.register(
  BarController,
  BarElement,
  CategoryScale,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
  Legend,
);
Chart.defaults.font.family = "Barlow, system-ui, sans-serif";
Chart.defaults.font.size = 13;
Chart.defaults.color = "#3B4866";
// Printing and screenshots must show the final frame, not a half-drawn animation.
Chart.defaults.animation = false;

export const COLOURS = {
  ink: "#1E2A44",
  gain: "#0F766E",
  decline: "#B45309",
  steady: "#64748B",
  inconclusive: "#586176",
  band: "#F3E9D8",
  grid: "#E7E3DA",
};

type VerdictMark = { colour: string; shape: "triangle" | "rectRot" | "circle" | "crossRot"; rotation: number };

/** Colour and point shape of a verdict: the shape carries it too, so colour is never alone. */
export function verdictMark(verdict: Verdict | null): VerdictMark {
  switch (verdict) {
    case "clear-gain":
    case "gain":
      return { colour: COLOURS.gain, shape: "triangle", rotation: 90 };
    case "clear-decline":
    case "decline":
      return { colour: COLOURS.decline, shape: "triangle", rotation: -90 };
    case "steady":
      return { colour: COLOURS.steady, shape: "rectRot", rotation: 0 };
    case "inconclusive":
      return { colour: COLOURS.inconclusive, shape: "crossRot", rotation: 0 };
    default:
      return { colour: COLOURS.ink, shape: "circle", rotation: 0 };
  }
}

/**
 * Shades [−SWC, +SWC] on the value axis ("x" for horizontal charts, "y" for vertical ones)
 * and draws the zero line, behind the datasets.
 */
export function swcBand<T extends ChartType>(swc: number, axis: "x" | "y"): Plugin<T> {
  return {
    id: "swcBand",
    beforeDatasetsDraw(chart) {
      const scale = chart.scales[axis];
      const { ctx, chartArea: area } = chart;
      if (!scale || !area) return;
      const a = scale.getPixelForValue(-swc);
      const b = scale.getPixelForValue(swc);
      const zero = scale.getPixelForValue(0);
      ctx.save();
      ctx.fillStyle = COLOURS.band;
      if (axis === "x") ctx.fillRect(Math.min(a, b), area.top, Math.abs(b - a), area.bottom - area.top);
      else ctx.fillRect(area.left, Math.min(a, b), area.right - area.left, Math.abs(b - a));
      ctx.strokeStyle = COLOURS.ink;
      ctx.lineWidth = 1;
      ctx.beginPath();
      if (axis === "x") {
        ctx.moveTo(zero, area.top);
        ctx.lineTo(zero, area.bottom);
      } else {
        ctx.moveTo(area.left, zero);
        ctx.lineTo(area.right, zero);
      }
      ctx.stroke();
      ctx.restore();
    },
  };
}

/** Points only (no line), each shaped and coloured by its verdict mark. */
export function verdictPoints(label: string, values: number[], marks: VerdictMark[], radius: number) {
  return {
    type: "line" as const,
    label,
    data: values,
    showLine: false,
    pointStyle: marks.map((m) => m.shape),
    pointRotation: marks.map((m) => m.rotation),
    pointRadius: radius,
    pointBackgroundColor: marks.map((m) => m.colour),
    pointBorderColor: COLOURS.ink,
  };
}

/** The interval charts lie on their side: categories down, the change across. */
/**
 * Ticks for an axis whose ends are set by the data (`min`/`max`): the end ticks are labelled only
 * when they fall on the axis's step, so it never reads "−239.1 … −150 … 238.05".
 */
export const ROUND_END_TICKS = {
  callback(this: Scale, value: number | string, index: number, ticks: Tick[]) {
    const edge = index === 0 || index === ticks.length - 1;
    const step = ticks.length > 2 ? ticks[2].value - ticks[1].value : 0;
    const ratio = step > 0 ? Number(value) / step : 0;
    return edge && Math.abs(ratio - Math.round(ratio)) > 1e-6 ? null : this.getLabelForValue(Number(value));
  },
};

export const LYING = { indexAxis: "y" as const, responsive: true, maintainAspectRatio: false };
