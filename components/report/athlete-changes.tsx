"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { type Column, TableCard } from "@/components/table-card";
import type { ChangeReportData } from "@/lib/client/queries";
import { FLAG_LABELS } from "@/lib/labels";
import { EXCLUSION_WORDS, intervalWords, percentWords, plain, signed } from "@/lib/words/report";
import { VerdictBadge } from "./verdict-badge";
import { VERDICT_ORDER } from "./verdict-order";

type Athlete = ChangeReportData["athletes"][number];
type SortKey = "name" | "pre" | "post" | "betterChange" | "percentChange" | "verdict";

const HEADINGS: { key: SortKey; label: string; right?: boolean }[] = [
  { key: "name", label: "Athlete" },
  { key: "pre", label: "First", right: true },
  { key: "post", label: "Second", right: true },
  { key: "betterChange", label: "Change", right: true },
  { key: "percentChange", label: "%", right: true },
  { key: "verdict", label: "Verdict" },
];

function sortValue(a: Athlete, key: SortKey): string | number {
  if (key === "verdict") return a.verdict === null ? 99 : VERDICT_ORDER[a.verdict];
  return a[key] ?? Number.NEGATIVE_INFINITY;
}

/** Each paired athlete's change against the test's noise, sortable; then who was left out and why. */
export function AthleteChanges({ report }: { report: ChangeReportData }) {
  const { test } = report;
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: "betterChange", dir: -1 });
  const rows = useMemo(
    () =>
      [...report.athletes].sort((a, b) => {
        const av = sortValue(a, sort.key);
        const bv = sortValue(b, sort.key);
        const order = typeof av === "string" ? av.localeCompare(String(bv)) : av - (bv as number);
        return order * sort.dir || a.name.localeCompare(b.name);
      }),
    [report.athletes, sort],
  );
  const columns: Column[] = [
    ...HEADINGS.map((h): Column => {
      const active = sort.key === h.key;
      return {
        align: h.right ? "right" : undefined,
        "aria-sort": active ? (sort.dir === 1 ? "ascending" : "descending") : "none",
        label: (
          <button
            type="button"
            className={`inline-flex items-center gap-1 font-semibold uppercase tracking-wide hover:text-ink ${h.right ? "flex-row-reverse" : ""}`}
            onClick={() =>
              setSort(
                active ? { key: h.key, dir: sort.dir === 1 ? -1 : 1 } : { key: h.key, dir: h.key === "name" ? 1 : -1 },
              )
            }
          >
            {h.label}
            <span aria-hidden className={active ? "text-ink" : "opacity-40"}>
              {active && sort.dir === 1 ? "▲" : "▼"}
            </span>
          </button>
        ),
      };
    }),
  ];
  if (test.typicalError !== null) columns.splice(5, 0, { label: "Interval (typical error)", align: "right" });

  return (
    <section aria-labelledby="athletes-heading" className="space-y-3">
      <div>
        <h2 id="athletes-heading" className="text-lg font-bold">
          Athletes
        </h2>
        <p className="text-sm text-ink-soft">
          Scores and changes in {test.unit}; “Change” is second − first
          {test.direction === "lower"
            ? ", so a faster (lower) time shows as a negative change and counts as a gain"
            : ""}
          .
        </p>
        {test.typicalError === null && (
          <p className="mt-2 rounded-md border border-line bg-band px-3 py-2 print:py-0 text-sm">
            {test.name} has no typical error yet, so no athlete gets an interval or a verdict: a change alone cannot be
            told from test noise. Measure it on a test–retest pair in the{" "}
            <Link href={`/reports/reliability?testId=${test.id}`} className="font-semibold underline">
              Reliability check
            </Link>
            , or enter a published value in the{" "}
            <Link href="/tests" className="font-semibold underline">
              Test library
            </Link>
            .
          </p>
        )}
      </div>
      <TableCard columns={columns} caption={`Change of each athlete in ${test.name}`}>
        {rows.map((a) => (
          <tr key={a.athleteId} className="border-b border-line last:border-0">
            <th scope="row" className="px-3 py-2 print:py-0 text-left font-semibold">
              <Link href={`/athletes/${a.athleteId}`} className="underline-offset-2 hover:underline">
                {a.name}
              </Link>
            </th>
            <td className="num px-3 py-2 print:py-0 text-right">{plain(a.pre, test.decimals)}</td>
            <td className="num px-3 py-2 print:py-0 text-right">{plain(a.post, test.decimals)}</td>
            <td className="num px-3 py-2 print:py-0 text-right">{signed(a.change, test.decimals)}</td>
            <td className="num px-3 py-2 print:py-0 text-right">{percentWords(a.percentChange)}</td>
            {test.typicalError !== null && (
              <td className="num whitespace-nowrap px-3 py-2 print:py-0 text-right">
                {a.ciLower === null || a.ciUpper === null
                  ? "–"
                  : intervalWords(a.ciLower, a.ciUpper, test.decimals, test.unit)}
              </td>
            )}
            <td className="px-3 py-2 print:py-0">
              <VerdictBadge verdict={a.verdict} />
            </td>
          </tr>
        ))}
      </TableCard>
      {report.excluded.length > 0 && (
        <div className="card p-4">
          <h3 className="font-semibold">Left out of the comparison</h3>
          <ul className="mt-1 space-y-0.5 text-sm">
            {report.excluded.map((e) => (
              <li key={e.athleteId}>
                <span className="font-semibold">{e.name}</span> — {EXCLUSION_WORDS[e.reason]}
                {e.flag ? ` (${FLAG_LABELS[e.flag].toLowerCase()})` : ""}
              </li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
