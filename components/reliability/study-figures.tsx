"use client";

import dynamic from "next/dynamic";
import type { ReactNode } from "react";
import type { ReliabilityStudy } from "@/lib/client/queries";
import { FLAG_LABELS } from "@/lib/labels";
import { kooLiBand } from "@/lib/reports/reliability-bands";
import { explainIcc, KOO_LI_LABELS } from "@/lib/words/reliability";
import {
  confidenceWords,
  EXCLUSION_WORDS,
  FILE_EXCLUSION_WORDS,
  intervalWords,
  plain,
  signed,
} from "@/lib/words/report";
import { explainSensitivity, SENSITIVITY_LABELS } from "@/lib/words/stats";
import { Planner } from "./planner";

// chart.js loads only when a chart is drawn, after the numbers are on screen.
const AgreementPlot = dynamic(() => import("@/components/charts/agreement-plot"), {
  ssr: false,
  loading: () => <div style={{ height: 300 }} className="animate-pulse rounded bg-paper" aria-hidden />,
});

/** Everything a test–retest study shows, whether its scores came from two sessions or from a file. */
export function StudyFigures({ report, plotKey }: { report: ReliabilityStudy; plotKey: string }) {
  return (
    <>
      <Results report={report} />
      <div className="grid gap-4 lg:grid-cols-2">
        <figure className="card p-4">
          <figcaption className="mb-2">
            <span className="font-bold">Differences against means</span>
            <span className="block text-sm text-ink-soft">
              Each athlete&apos;s second minus first score against the mean of the two. The solid line is the change in
              mean, the dashed lines the 95 % limits of agreement (
              {intervalWords(
                report.limitsOfAgreement.lower,
                report.limitsOfAgreement.upper,
                report.test.decimals + 1,
                report.test.unit,
              )}
              ).
            </span>
          </figcaption>
          <AgreementPlot key={plotKey} report={report} />
        </figure>
        <Planner report={report} />
      </div>
      <Pairs report={report} />
    </>
  );
}

/** The cautions every Reliability check carries (PRODUCT.md §8). */
export function ReliabilityCautions() {
  return (
    <p className="text-xs text-ink-soft">
      A reliability study holds only for the athletes, equipment, protocol and testers it was run with; retest under the
      same conditions, a few days apart, with no training between. Results support training decisions; they are not a
      medical or return-to-play judgement — defer to your medical staff and licensed practitioners. Maximal tests carry
      injury risk: screen, warm up and supervise as your organisation&apos;s and governing body&apos;s protocols
      require. Athlete data is personal data: share results only as your consent and data-protection rules allow.
    </p>
  );
}

function Figure({ label, children, note }: { label: string; children: ReactNode; note?: ReactNode }) {
  return (
    <div className="border-t border-line py-2">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">{label}</dt>
      <dd className="num text-base">{children}</dd>
      {note && <dd className="text-xs text-ink-soft">{note}</dd>}
    </div>
  );
}

const icc = (value: number | null) => (value === null ? "–" : value.toFixed(3));

function Results({ report }: { report: ReliabilityStudy }) {
  const { test, confidence } = report;
  const d = test.decimals + 1;
  const unit = test.unit;
  const level = confidenceWords(confidence);
  const band = (v: number | null) => (v === null ? null : kooLiBand(v));
  return (
    <section aria-labelledby="reliability-results" className="card p-4">
      <h2 id="reliability-results" className="text-lg font-bold">
        Test–retest result
      </h2>
      <dl className="grid gap-x-6 sm:grid-cols-2 lg:grid-cols-3">
        <Figure
          label="Athletes paired"
          note={report.excluded.length > 0 ? `${report.excluded.length} left out (listed below)` : undefined}
        >
          {report.n}
        </Figure>
        <Figure label="Typical error" note={`${level} limits, ${report.df} df`}>
          {plain(report.typicalError, d)} {unit} ({plain(report.typicalErrorLower, d)} to{" "}
          {plain(report.typicalErrorUpper, d)} {unit})
        </Figure>
        <Figure label="CV" note="from log-transformed scores">
          {report.cvPercent === null ? "– (needs scores above zero)" : `${report.cvPercent.toFixed(2)} %`}
        </Figure>
        <Figure label="Change in mean" note={`second − first, ${level} interval`}>
          {signed(report.changeInMean, d)} {unit} ({intervalWords(report.changeLower, report.changeUpper, d, unit)})
        </Figure>
        <Figure label="ICC(3,1) consistency" note={`${level} limits`}>
          {icc(report.icc31)} ({icc(report.icc31Lower)} to {icc(report.icc31Upper)})
          {report.iccReading && ` · ${KOO_LI_LABELS[report.iccReading]}`}
        </Figure>
        <Figure label="ICC(2,1) absolute agreement" note={`${level} limits`}>
          {icc(report.icc21)} ({icc(report.icc21Lower)} to {icc(report.icc21Upper)})
          {report.icc21 !== null && ` · ${KOO_LI_LABELS[kooLiBand(report.icc21)]}`}
        </Figure>
        <Figure
          label="Smallest worthwhile change"
          note={`the test's own SWC method, from the ${report.file ? "first trial's" : "first session's"} scores`}
        >
          {plain(report.swc, d)} {unit}
        </Figure>
      </dl>
      {report.iccReading && (
        <p className="mt-2 text-sm">
          {explainIcc(report.iccReading, band(report.icc31Lower), band(report.icc31Upper))}
        </p>
      )}
      {report.sensitivity ? (
        <p className="mt-2 text-sm">
          <span className="font-semibold">{SENSITIVITY_LABELS[report.sensitivity.rating]}.</span>{" "}
          {explainSensitivity(report.sensitivity)}
        </p>
      ) : (
        <p className="mt-2 text-sm">With an SWC of zero the test&apos;s sensitivity cannot be rated.</p>
      )}
    </section>
  );
}

function Pairs({ report }: { report: ReliabilityStudy }) {
  const { test, pairs, excluded } = report;
  const d = test.decimals;
  return (
    <section aria-labelledby="pairs-heading" className="card relative overflow-x-auto p-4">
      <h2 id="pairs-heading" className="text-lg font-bold">
        Athletes
      </h2>
      <table className="mt-2 w-full text-sm">
        <caption className="sr-only">Each athlete&apos;s score in the two sessions and the difference</caption>
        <thead>
          <tr className="text-left">
            <th scope="col">Athlete</th>
            <th scope="col" className="text-right">
              First ({test.unit})
            </th>
            <th scope="col" className="text-right">
              Second ({test.unit})
            </th>
            <th scope="col" className="text-right">
              Difference ({test.unit})
            </th>
          </tr>
        </thead>
        <tbody>
          {pairs.map((p) => (
            <tr key={p.athleteId} className="border-t border-line">
              <th scope="row" className="text-left font-normal">
                {p.name}
              </th>
              <td className="num text-right">{plain(p.first, d)}</td>
              <td className="num text-right">{plain(p.second, d)}</td>
              <td className="num text-right">{signed(p.second - p.first, d)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {excluded.length > 0 && (
        <>
          <h3 className="mt-3 font-semibold">Left out</h3>
          <ul className="text-sm">
            {excluded.map((x) => (
              <li key={x.athleteId}>
                {x.name}: {(report.file ? FILE_EXCLUSION_WORDS : EXCLUSION_WORDS)[x.reason]}
                {x.flag && ` (${FLAG_LABELS[x.flag]})`}
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}
