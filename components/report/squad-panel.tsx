import type { ReactNode } from "react";
import type { ChangeReportData } from "@/lib/client/queries";
import {
  confidenceWords,
  intervalWords,
  percentWords,
  plain,
  pWords,
  SQUAD_VERDICT_SENTENCES,
  signed,
  swcSourceWords,
} from "@/lib/words/report";
import { MAGNITUDE_LABELS } from "@/lib/words/stats";
import { SquadIntervalChart } from "./report-charts";
import { VerdictBadge } from "./verdict-badge";

function Figure({ label, children, note }: { label: string; children: ReactNode; note?: ReactNode }) {
  return (
    <div className="border-t border-line py-2 print:py-0.5">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">{label}</dt>
      <dd className="num text-base">{children}</dd>
      {note && <dd className="text-xs text-ink-soft">{note}</dd>}
    </div>
  );
}

/** The squad's result: verdict, interval against the SWC, and every figure behind it. */
export function SquadPanel({ report }: { report: ChangeReportData }) {
  const { squad, test, settings } = report;
  const d = test.decimals + 1;
  const unit = test.unit;
  const pct = (share: number) => `${Math.round(share * 100)} %`;
  const tLabel = `t${(1 - (1 - settings.confidence) / 2).toFixed(3).replace(/0+$/, "")}(${squad.df})`;
  return (
    <section aria-labelledby="squad-result" className="card p-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="squad-result" className="text-lg font-bold">
          Squad result
        </h2>
        <VerdictBadge verdict={squad.verdict} large />
      </div>
      <p className="mt-1 text-sm">{SQUAD_VERDICT_SENTENCES[squad.verdict]}</p>
      <SquadIntervalChart report={report} />
      <dl className="grid gap-x-6 sm:grid-cols-2 lg:grid-cols-3 print:grid-cols-5 print:gap-x-3">
        <Figure
          label="Athletes paired"
          note={report.excluded.length > 0 ? `${report.excluded.length} left out (listed below)` : undefined}
        >
          {squad.n}
        </Figure>
        <Figure label="Mean, first → second">
          {plain(squad.meanPre, d)} → {plain(squad.meanPost, d)} {unit}
        </Figure>
        <Figure label="Mean change" note={`SD of changes ${plain(squad.sdDiff, d)} ${unit}`}>
          {signed(squad.meanDiff, d)} {unit} ({percentWords(squad.percentChange)})
        </Figure>
        <Figure
          label={`${confidenceWords(settings.confidence)} interval`}
          note={`${tLabel} = ${squad.tCritical.toFixed(3)}, SE ${plain(squad.standardError, d)} ${unit}`}
        >
          {intervalWords(squad.ciLower, squad.ciUpper, d, unit)}
        </Figure>
        <Figure label="Paired t-test" note="Two-sided, against no change">
          {squad.t === null
            ? "every athlete changed by the same amount"
            : `t(${squad.df}) = ${squad.t.toFixed(2)}, p ${squad.p !== null && squad.p < 0.001 ? "" : "= "}${pWords(squad.p)}`}
        </Figure>
        <Figure label="Effect size" note="d_z = mean change ÷ SD of changes; g_z with Hedges' correction">
          {squad.effectSizeDz === null
            ? "–"
            : `d_z ${squad.effectSizeDz.toFixed(2)} · g_z ${squad.hedgesGz?.toFixed(2)}`}
        </Figure>
        <Figure label="Magnitude" note="Mean change in between-athlete SDs, on the scale of Hopkins et al. (2009)">
          {squad.magnitude === null || squad.standardisedChange === null
            ? "–"
            : `${MAGNITUDE_LABELS[squad.magnitude]} (${signed(squad.standardisedChange, 2)} SD)`}
        </Figure>
        <Figure
          label="Smallest worthwhile change"
          note={swcSourceWords(settings.swcMethod, settings.swcValue, unit, settings.swcSource === "test")}
        >
          {plain(squad.swc, d)} {unit}
        </Figure>
        <Figure label="Athletes beyond the SWC" note="Observed changes, before any allowance for test noise">
          {pct(squad.shareBeyondSwc)} improved by more · {pct(squad.shareBelowSwc)} declined by more
        </Figure>
        <Figure
          label="Individual responses"
          note="√(SD of changes² − 2·TE²) (Atkinson & Batterham 2015; Swinton et al. 2018)"
        >
          {squad.individualResponseSd === null
            ? "Needs the test's typical error"
            : squad.individualResponseSd === 0
              ? "No sign of individual differences beyond the test's noise"
              : `SD ${plain(squad.individualResponseSd, d)} ${unit}`}
        </Figure>
      </dl>
    </section>
  );
}
