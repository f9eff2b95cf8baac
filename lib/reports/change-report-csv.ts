/**
 * The Change report as CSV: the squad's figures, then one row per athlete, then who was left
 * out and why. Numbers go out as numbers (full precision, so a spreadsheet can recompute);
 * every text cell passes through toCsv, which neutralises cells a spreadsheet would execute.
 */
import { toCsv } from "@/lib/csv";
import type { ChangeReport } from "./change-report";

type Meta = {
  test: { name: string; unit: string; direction: "higher" | "lower"; typicalError: number | null };
  sessions: { from: { date: string; squadName: string }; to: { date: string } };
};

export function changeReportCsv(report: ChangeReport & Meta): string {
  const { squad, settings, test } = report;
  const unit = test.unit;
  const rows: (string | number | null)[][] = [
    ["Change report", test.name],
    ["Squad", report.sessions.from.squadName],
    ["First session", report.sessions.from.date],
    ["Second session", report.sessions.to.date],
    ["Better is", test.direction === "higher" ? "higher" : "lower"],
    ["Confidence", settings.confidence],
    [],
    ["Squad figure", "Value", "Unit"],
    ["Athletes paired", squad.n, null],
    ["Degrees of freedom", squad.df, null],
    ["Mean, first session", squad.meanPre, unit],
    ["Mean, second session", squad.meanPost, unit],
    ["Mean change (second − first)", squad.meanDiff, unit],
    ["Mean change", squad.percentChange, "%"],
    ["SD of changes", squad.sdDiff, unit],
    ["Standard error", squad.standardError, unit],
    ["t critical value", squad.tCritical, null],
    ["Interval lower", squad.ciLower, unit],
    ["Interval upper", squad.ciUpper, unit],
    ["t", squad.t, null],
    ["p (two-sided)", squad.p, null],
    ["d_z", squad.effectSizeDz, null],
    ["Hedges' g_z", squad.hedgesGz, null],
    ["Change in between-athlete SDs", squad.standardisedChange, null],
    ["Magnitude", squad.magnitude, null],
    ["Smallest worthwhile change", squad.swc, unit],
    ["SWC method", `${settings.swcMethod} ${settings.swcValue}`, settings.swcSource],
    ["Share improved beyond the SWC", squad.shareBeyondSwc, null],
    ["Share declined beyond the SWC", squad.shareBelowSwc, null],
    ["SD of individual responses", squad.individualResponseSd, unit],
    ["Verdict", squad.verdict, null],
    [],
    [
      "Athlete",
      `First (${unit})`,
      `Second (${unit})`,
      `Change (${unit})`,
      "Change (%)",
      "Interval lower",
      "Interval upper",
      "Verdict",
    ],
    ...report.athletes.map((a) => [a.name, a.pre, a.post, a.change, a.percentChange, a.ciLower, a.ciUpper, a.verdict]),
  ];
  if (report.excluded.length > 0) {
    rows.push([], ["Left out", "Reason", "Flag"], ...report.excluded.map((e) => [e.name, e.reason, e.flag]));
  }
  return toCsv(rows);
}
