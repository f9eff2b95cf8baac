"use client";

import { useState } from "react";
import type { RowError } from "@/lib/errors";
import type { ReplacementRow } from "@/lib/import/summary";
import { formatValue } from "@/lib/labels";

/** Problems by row and column: what blocks the import, and what it would replace. */
export function ProblemList({ errors, errorCount, title }: { errors: RowError[]; errorCount: number; title?: string }) {
  const [all, setAll] = useState(false);
  if (errorCount === 0) return null;
  const shown = all ? errors : errors.slice(0, 25);
  return (
    <section aria-labelledby="problems-h" className="card border-decline p-4">
      <h2 id="problems-h" className="text-lg font-bold">
        {title ?? `${errorCount} ${errorCount === 1 ? "problem" : "problems"} to fix before importing`}
      </h2>
      <p className="text-sm text-ink-soft">
        Nothing is imported while any remain. Row numbers are as a spreadsheet shows them (the header is row 1).
      </p>

      <table className="mt-3 w-full text-left text-sm">
        <caption className="sr-only">Problems by row and column</caption>
        <thead className="border-b border-line text-xs text-ink-faint">
          <tr>
            <th scope="col" className="w-16 py-1.5 pr-3 text-right font-semibold">
              Row
            </th>
            <th scope="col" className="w-48 py-1.5 pr-3 font-semibold">
              Column
            </th>
            <th scope="col" className="py-1.5 font-semibold">
              Problem
            </th>
          </tr>
        </thead>
        <tbody>
          {shown.map((e, i) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: a fixed list, never reordered; two problems may read the same
            <tr key={i} className="border-b border-line last:border-0 align-top">
              <td className="num py-1.5 pr-3 text-right">{e.row}</td>
              <td className="py-1.5 pr-3 font-semibold">{e.column ?? "–"}</td>
              <td className="py-1.5">{e.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {errors.length > shown.length && (
        <button type="button" className="btn-quiet mt-2" onClick={() => setAll(true)}>
          Show all {errors.length} listed
        </button>
      )}
      {errorCount > errors.length && (
        <p className="mt-2 text-sm text-ink-soft">
          The first {errors.length} of <span className="num">{errorCount}</span> are listed; fix these and check the
          file again.
        </p>
      )}
    </section>
  );
}

export function WarningList({ warnings, count }: { warnings: RowError[]; count: number }) {
  if (count === 0) return null;
  return (
    <details className="card bg-band/40 p-4">
      <summary className="cursor-pointer font-semibold">
        {count} {count === 1 ? "value looks" : "values look"} implausible (they do not block the import)
      </summary>
      <ul className="mt-2 space-y-1 text-sm">
        {warnings.slice(0, 50).map((w, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: a fixed list, never reordered; two problems may read the same
          <li key={i}>
            <span className="num font-semibold">Row {w.row}</span>
            {w.column ? ` · ${w.column}` : ""}: {w.message}
          </li>
        ))}
      </ul>
    </details>
  );
}

export function ReplacementList({
  rows,
  count,
  tests,
}: {
  rows: ReplacementRow[];
  count: number;
  /** The battery, for each score in its test's decimals. */
  tests: { name: string; decimals: number }[];
}) {
  if (count === 0) return null;
  const decimals = new Map(tests.map((t) => [t.name, t.decimals]));
  const score = (value: number | null, testName: string) =>
    value === null ? null : formatValue(value, decimals.get(testName) ?? 2);
  return (
    <section aria-labelledby="replace-h" className="card bg-band/40 p-4">
      <h2 id="replace-h" className="text-lg font-bold">
        {count} stored {count === 1 ? "value" : "values"} would be replaced
      </h2>
      <p className="text-sm text-ink-soft">
        The session already holds these. They are only replaced if you tick the box below.
      </p>
      <table className="mt-2 w-full text-left text-sm">
        <caption className="sr-only">Stored values this file would replace</caption>
        <thead className="border-b border-line text-xs text-ink-faint">
          <tr>
            <th scope="col" className="w-16 py-1.5 pr-3 text-right font-semibold">
              Row
            </th>
            <th scope="col" className="py-1.5 pr-3 font-semibold">
              Athlete
            </th>
            <th scope="col" className="py-1.5 pr-3 font-semibold">
              Test
            </th>
            <th scope="col" className="py-1.5 pr-3 text-right font-semibold">
              Trial
            </th>
            <th scope="col" className="py-1.5 pr-3 text-right font-semibold">
              Stored
            </th>
            <th scope="col" className="py-1.5 text-right font-semibold">
              In the file
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.slice(0, 50).map((r, i) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: a fixed list, never reordered; two problems may read the same
            <tr key={i} className="border-b border-line last:border-0">
              <td className="num py-1.5 pr-3 text-right">{r.row}</td>
              <td className="py-1.5 pr-3">{r.athleteName}</td>
              <td className="py-1.5 pr-3">{r.testName}</td>
              <td className="num py-1.5 pr-3 text-right">{r.trial ?? "–"}</td>
              <td className="num py-1.5 pr-3 text-right">
                {r.trial === null ? `marked ${r.previousFlag}` : score(r.previous, r.testName)}
              </td>
              <td className="num py-1.5 text-right">{score(r.next, r.testName) ?? "scores"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {count > 50 && <p className="mt-2 text-sm text-ink-soft">and {count - 50} more.</p>}
    </section>
  );
}
