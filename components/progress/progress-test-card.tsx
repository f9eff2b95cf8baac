"use client";

import dynamic from "next/dynamic";
import { VerdictBadge } from "@/components/report/verdict-badge";
import { type Column, TableCard } from "@/components/table-card";
import type { MyProgressData } from "@/lib/client/queries";
import { FLAG_LABELS, formatDate } from "@/lib/labels";
import { changeSentence, noVerdictWords, VERDICT_SENTENCES } from "@/lib/words/progress";
import { intervalWords, plain, signed } from "@/lib/words/report";
import { directionWords } from "@/lib/words/tests";

// chart.js loads only where a chart is drawn, after the numbers are on screen.
const ProgressLine = dynamic(() => import("@/components/charts/progress-line"), {
  ssr: false,
  loading: () => <div style={{ height: 240 }} className="animate-pulse rounded bg-paper" aria-hidden />,
});

type Test = MyProgressData["tests"][number];

const COLUMNS: Column[] = [{ label: "Date" }, { label: "Score", align: "right" }, { label: "Change", align: "right" }];

/** One test on My progress: the latest change in words, the personal best, the Progress line and the scores. */
export function ProgressTestCard({ test, confidence, minSquad }: { test: Test; confidence: number; minSquad: number }) {
  const dir = directionWords(test.direction);
  const { latest, best } = test;
  const headingId = `my-test-${test.id}`;
  const value = (v: number) => `${plain(v, test.decimals)} ${test.unit}`;
  const usable = test.scores.filter((s) => s.value !== null && s.flag === null);
  return (
    <article aria-labelledby={headingId} className="card space-y-3 p-4">
      <div>
        <h2 id={headingId} className="text-lg font-bold">
          {test.name}
        </h2>
        <p className="text-sm text-ink-soft">
          {test.unit} · <span aria-hidden>{dir.arrow}</span> {dir.words}
          {best && (
            <>
              {" "}
              · Personal best <span className="num font-semibold text-ink">{value(best.value)}</span>{" "}
              <span className="whitespace-nowrap">({formatDate(best.date)})</span>
            </>
          )}
        </p>
      </div>

      {latest ? (
        <div className="space-y-1">
          <div className="flex flex-wrap items-center gap-2">
            <span className="text-sm font-semibold">Latest change</span>
            {latest.verdict && <VerdictBadge verdict={latest.verdict} />}
          </div>
          <p>
            {changeSentence({
              testName: test.name,
              unit: test.unit,
              decimals: test.decimals,
              direction: test.direction,
              change: latest.change!,
              previousDate: latest.previousDate,
            })}{" "}
            {latest.verdict ? VERDICT_SENTENCES[latest.verdict] : noVerdictWords(test.swcBasis, minSquad)}
          </p>
          {latest.ciLower !== null && latest.ciUpper !== null && latest.swc !== null && (
            <p className="text-sm text-ink-soft">
              {Math.round(confidence * 100)} % interval of your true change
              {test.direction === "lower" ? " (a minus is an improvement here)" : ""}:{" "}
              <span className="num whitespace-nowrap">
                {intervalWords(latest.ciLower, latest.ciUpper, test.decimals, test.unit)}
              </span>
              ; smallest change that matters:{" "}
              <span className="num whitespace-nowrap">
                ± {plain(latest.swc, test.decimals)} {test.unit}
              </span>
              {test.swcBasis === "squad" && " (from your squad's spread that day; no one's score is shown)"}.
            </p>
          )}
        </div>
      ) : (
        <p className="text-sm text-ink-soft">
          {usable.length === 1
            ? "One score so far: your change appears after your next published test."
            : "No change to show yet."}
        </p>
      )}

      {usable.length > 0 && (
        <figure>
          <figcaption className="mb-1 text-sm">
            <span className="font-bold">Progress line</span>
            <span className="text-ink-soft">
              {test.typicalError !== null
                ? ` — your scores, each with its noise band (± typical error, ${test.typicalError} ${test.unit}, sand bars)`
                : " — your scores over time; no noise band until the test has a typical error"}
              {latest?.swc != null
                ? "; the dashed box is the smallest change that matters around your previous score: a latest score outside it moved by more than that."
                : "."}
            </span>
          </figcaption>
          <ProgressLine
            key={`${test.id}:${test.typicalError}`}
            test={test}
            swcBand={
              latest && latest.swc !== null && latest.previousValue !== null
                ? { around: latest.previousValue, swc: latest.swc }
                : undefined
            }
          />
        </figure>
      )}

      <TableCard columns={COLUMNS} caption={`Your ${test.name} scores, newest first`}>
        {[...test.scores].reverse().map((s) => (
          <tr key={s.resultId} className="border-b border-line last:border-0">
            <th scope="row" className="whitespace-nowrap px-3 py-2 text-left font-semibold">
              {formatDate(s.date)}
            </th>
            <td className="num whitespace-nowrap px-3 py-2 text-right">
              {s.flag ? (
                <span className="rounded bg-steady-soft px-1.5 py-0.5 text-xs">{FLAG_LABELS[s.flag]}</span>
              ) : s.value === null ? (
                "–"
              ) : (
                value(s.value)
              )}
            </td>
            <td className="num whitespace-nowrap px-3 py-2 text-right">
              {s.change === null ? "–" : `${signed(s.change, test.decimals)} ${test.unit}`}
            </td>
          </tr>
        ))}
      </TableCard>
    </article>
  );
}
