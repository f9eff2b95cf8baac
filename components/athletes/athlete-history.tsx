"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import Link from "next/link";
import { VerdictBadge } from "@/components/report/verdict-badge";
import { type Column, TableCard } from "@/components/table-card";
import { type AthleteHistoryData, athleteQueries } from "@/lib/client/queries";
import { FLAG_LABELS, formatDate, formatValue, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";
import type { SwcBasis } from "@/lib/reports/athlete-history";
import { confidenceWords, intervalWords, signed } from "@/lib/words/report";
import { directionWords } from "@/lib/words/tests";

// chart.js loads only where a chart is drawn, after the numbers are on screen.
const ProgressLine = dynamic(() => import("@/components/charts/progress-line"), {
  ssr: false,
  loading: () => <div style={{ height: 240 }} className="animate-pulse rounded bg-paper" aria-hidden />,
});

type Test = AthleteHistoryData["tests"][number];

const BASIS_WORDS: Record<SwcBasis, string> = {
  fixed: "Verdicts read each change against the test's fixed smallest worthwhile change.",
  cv: "Verdicts read each change against a smallest worthwhile change from the test's CV% and the athlete's previous score.",
  squad:
    "Verdicts read each change against the smallest worthwhile change from the squad's spread in the session it starts from.",
  "needs-squad":
    "No verdicts here: this test's smallest worthwhile change is a share of a squad's between-athlete SD, which one athlete's scores cannot give. The Change report reads it against the squad.",
  "no-cv": "No verdicts here: this test's smallest worthwhile change needs a CV%, and the Test library has none yet.",
  "no-te":
    "No intervals or verdicts here: the test has no typical error yet, so a change cannot be told from test noise.",
};

/** Athlete history: one card per test with its Progress line and the sessions' scores and changes. */
export function AthleteHistory({ athleteId }: { athleteId: number }) {
  const { data } = useSuspenseQuery(athleteQueries.history(athleteId));
  const { athlete } = data;
  return (
    <section aria-labelledby="history-heading" className="space-y-4">
      <div>
        <p className="text-sm text-ink-soft">Athlete history</p>
        <h1 id="history-heading" className="text-2xl font-bold">
          {athlete.name}
          {athlete.archived && (
            <span className="ml-2 rounded bg-steady-soft px-1.5 py-0.5 align-middle text-xs text-ink-soft">
              Archived
            </span>
          )}
        </h1>
        <p className="text-sm text-ink-soft">
          {athlete.position ? `${athlete.position} · ` : ""}
          {athlete.squads.length === 0
            ? "In none of your squads now"
            : athlete.squads.map((s, i) => (
                <span key={s.id}>
                  {i > 0 && ", "}
                  <Link href={`/squads/${s.id}`} className="underline underline-offset-2">
                    {s.name}
                  </Link>
                </span>
              ))}
        </p>
        <p className="mt-1 text-sm text-ink-soft">
          Every score over time, draft sessions included. Each change is from the athlete&apos;s previous score in the
          same test, with a {confidenceWords(data.confidence)} interval from the test&apos;s typical error.
        </p>
      </div>
      {data.tests.length === 0 ? (
        <p className="card p-6 text-ink-soft">No scores yet in any session you can see.</p>
      ) : (
        data.tests.map((test) => <TestCard key={test.id} test={test} />)
      )}
      <p className="text-xs text-ink-soft">
        These numbers support training decisions; they are not a medical or return-to-play judgement.
      </p>
    </section>
  );
}

function TestCard({ test }: { test: Test }) {
  const dir = directionWords(test.direction);
  const withInterval = test.swcBasis === "fixed" || test.swcBasis === "cv";
  const columns: Column[] = [
    { label: "Date" },
    { label: "Session" },
    { label: "Score", align: "right" },
    { label: "Change", align: "right" },
    ...(withInterval ? [{ label: "Interval", align: "right" as const }] : []),
    { label: "Verdict" },
  ];
  const headingId = `test-${test.id}`;
  const usable = test.scores.filter((s) => s.value !== null && s.flag === null).length;
  return (
    <article aria-labelledby={headingId} className="card space-y-3 p-4">
      <div>
        <h2 id={headingId} className="text-lg font-bold">
          {test.name}
        </h2>
        <p className="text-sm text-ink-soft">
          {test.unit} · <span aria-hidden>{dir.arrow}</span> {dir.words} · typical error{" "}
          {test.typicalError === null ? (
            "not set"
          ) : (
            <span className="num">
              {test.typicalError} {test.unit}
            </span>
          )}
        </p>
        <p className="mt-1 text-sm text-ink-soft">{BASIS_WORDS[test.swcBasis]}</p>
      </div>
      {usable > 0 && (
        <figure>
          <figcaption className="mb-1 text-sm">
            <span className="font-bold">Progress line</span>
            <span className="text-ink-soft">
              {test.typicalError !== null
                ? " — each score with its noise band (± typical error, shaded); ▶ gain, ◀ decline, ◆ steady, ✕ inconclusive."
                : " — scores over time; no noise band until the test has a typical error."}
            </span>
          </figcaption>
          <ProgressLine key={`${test.id}:${test.typicalError}`} test={test} />
        </figure>
      )}
      <TableCard columns={columns} caption={`Scores of ${test.name} over time`}>
        {[...test.scores].reverse().map((s) => (
          <tr key={s.resultId} className="border-b border-line last:border-0">
            <th scope="row" className="whitespace-nowrap px-3 py-2 text-left font-semibold">
              <Link href={`/sessions/${s.sessionId}`} className="underline-offset-2 hover:underline">
                {formatDate(s.date)}
              </Link>
            </th>
            <td className="px-3 py-2">
              {PHASE_LABELS[s.phase]} · {s.squadName}
              {s.status === "draft" && <span className="ml-1 text-xs text-ink-soft">({STATUS_LABELS.draft})</span>}
            </td>
            <td className="num whitespace-nowrap px-3 py-2 text-right">
              {s.flag ? (
                <span className="rounded bg-steady-soft px-1.5 py-0.5 text-xs">{FLAG_LABELS[s.flag]}</span>
              ) : s.value === null ? (
                "–"
              ) : (
                `${formatValue(s.value, test.decimals)} ${test.unit}`
              )}
            </td>
            <td className="num whitespace-nowrap px-3 py-2 text-right">
              {s.change === null ? "–" : `${signed(s.change, test.decimals)} ${test.unit}`}
            </td>
            {withInterval && (
              <td className="num whitespace-nowrap px-3 py-2 text-right">
                {s.ciLower === null || s.ciUpper === null
                  ? "–"
                  : intervalWords(s.ciLower, s.ciUpper, test.decimals, test.unit)}
              </td>
            )}
            <td className="px-3 py-2">
              <VerdictBadge verdict={s.verdict} />
            </td>
          </tr>
        ))}
      </TableCard>
    </article>
  );
}
