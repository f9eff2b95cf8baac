"use client";

import { useState } from "react";
import type { RowError } from "@/lib/errors";
import type { ReplacementRow } from "@/lib/import/summary";
import type { UnknownAthlete, UnknownTest } from "@/lib/import/types";

const rowsText = (rows: number[], count: number) =>
  `${rows.length === 1 ? "row" : "rows"} ${rows.join(", ")}${count > rows.length ? ` and ${count - rows.length} more` : ""}`;

/** Problems by row and column: what blocks the import, and what it would replace. */
export function ProblemList({
  errors,
  errorCount,
  unknownAthletes,
  unknownTests,
  title,
  unknownAthleteCount,
}: {
  errors: RowError[];
  errorCount: number;
  unknownAthletes: UnknownAthlete[];
  unknownTests: UnknownTest[];
  title?: string;
  unknownAthleteCount?: number;
}) {
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

      {unknownAthletes.length > 0 && (
        <div className="mt-3">
          <h3 className="text-sm font-semibold">Athletes not found on the roster</h3>
          <ul className="mt-1 flex flex-wrap gap-2 text-sm">
            {unknownAthletes.slice(0, 40).map((a) => (
              <li key={a.value} className="rounded border border-line bg-paper px-2 py-0.5">
                <span className="font-semibold">{a.value}</span>{" "}
                <span className="text-ink-soft">
                  {a.reason === "ambiguous" ? "two athletes share this name · " : ""}
                  {rowsText(a.rows, a.count)}
                </span>
                {a.suggestions && a.suggestions.length > 0 && (
                  <span className="block text-ink">
                    did you mean <span className="font-semibold">{a.suggestions.join(" or ")}</span>?
                  </span>
                )}
              </li>
            ))}
            {(unknownAthleteCount ?? unknownAthletes.length) > 40 && (
              <li className="text-ink-soft">and {(unknownAthleteCount ?? unknownAthletes.length) - 40} more</li>
            )}
          </ul>
        </div>
      )}
      {unknownTests.length > 0 && (
        <div className="mt-3">
          <h3 className="text-sm font-semibold">Tests not found in this session's battery</h3>
          <ul className="mt-1 flex flex-wrap gap-2 text-sm">
            {unknownTests.map((t) => (
              <li key={`${t.name}|${t.column ?? ""}`} className="rounded border border-line bg-paper px-2 py-0.5">
                <span className="font-semibold">{t.name}</span>{" "}
                <span className="text-ink-soft">
                  {t.reason === "not-in-battery"
                    ? "in the Test library, not in this battery"
                    : "not in the Test library"}{" "}
                  · {t.column ? "column header" : rowsText(t.rows, t.count)}
                </span>
                {t.suggestions && t.suggestions.length > 0 && (
                  <span className="block text-ink">
                    did you mean <span className="font-semibold">{t.suggestions.join(" or ")}</span>?
                  </span>
                )}
              </li>
            ))}
          </ul>
        </div>
      )}

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

export function ReplacementList({ rows, count }: { rows: ReplacementRow[]; count: number }) {
  if (count === 0) return null;
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
                {r.trial === null ? `marked ${r.previousFlag}` : r.previous}
              </td>
              <td className="num py-1.5 text-right">{r.next ?? "scores"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {count > 50 && <p className="mt-2 text-sm text-ink-soft">and {count - 50} more.</p>}
    </section>
  );
}
