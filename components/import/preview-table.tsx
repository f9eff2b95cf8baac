"use client";

import { type Column, TableCard } from "@/components/table-card";
import type { ImportPreview } from "@/lib/import/summary";
import { formatValue } from "@/lib/labels";

const PARSED_COLUMNS: Column[] = [
  { label: "Row", align: "right" },
  { label: "Athlete" },
  { label: "Test" },
  { label: "Trial", align: "right" },
  { label: "Score", align: "right" },
];

/** The first rows of the file as written, with the cells that have a problem marked. */
export function PreviewTable({ preview }: { preview: ImportPreview }) {
  const problems = new Map<string, string>();
  const rowProblems = new Map<number, string>();
  for (const e of preview.errors) {
    if (e.column) problems.set(`${e.row}|${e.column}`, e.message);
    else rowProblems.set(e.row, e.message);
  }
  const warnings = new Map(preview.warnings.map((w) => [`${w.row}|${w.column}`, w.message]));
  const headerProblems = new Set(
    preview.errors.filter((e) => e.row === preview.headerRow && e.column).map((e) => e.column),
  );
  // A long file's value errors sit on the value column, a wide file's on its own column.
  const cellKey = (row: number, header: string) => `${row}|${header}`;
  const columns: Column[] = [
    { label: "Row", align: "right" },
    ...preview.headers.map(
      (h): Column => ({
        label: h || <span className="italic">(no header)</span>,
        className: headerProblems.has(h) ? "bg-decline-soft text-ink" : "",
        title: headerProblems.has(h)
          ? preview.errors.find((e) => e.column === h && e.row === preview.headerRow)?.message
          : undefined,
      }),
    ),
  ];

  return (
    <TableCard
      asWritten
      headCellClass="px-3 py-2 font-semibold"
      caption={
        <>
          The first {preview.sample.length} of <span className="num">{preview.rowCount}</span> rows as written in the
          file.{preview.errorCount > 0 && " Marked cells have a problem, listed above."}
        </>
      }
      columns={columns}
    >
      {preview.sample.map(({ row, cells }) => (
        <tr key={row} className="border-b border-line last:border-0">
          <th
            scope="row"
            className={`num px-3 py-1.5 text-right font-normal text-ink-faint ${rowProblems.has(row) ? "bg-decline-soft text-ink" : ""}`}
            title={rowProblems.get(row)}
          >
            {row}
          </th>
          {preview.headers.map((h, i) => {
            const problem = problems.get(cellKey(row, h));
            const warning = warnings.get(cellKey(row, h));
            return (
              <td
                // biome-ignore lint/suspicious/noArrayIndexKey: cells of a file row: the column position is the cell's identity
                key={i}
                title={problem ?? warning}
                className={`num whitespace-nowrap px-3 py-1.5 ${problem ? "bg-decline-soft font-semibold outline outline-1 -outline-offset-1 outline-decline" : warning ? "bg-band" : ""}`}
              >
                {cells[i] ?? ""}
                {problem && <span className="sr-only"> (problem: {problem})</span>}
              </td>
            );
          })}
        </tr>
      ))}
    </TableCard>
  );
}

/** In the test's decimals, as the Session sheet shows it. */
const scoreText = (value: number, test: { decimals: number } | undefined) =>
  test ? formatValue(value, test.decimals) : String(value);

/** How the first values read: the roster name, the test and the trial each one goes to. */
export function ParsedValues({ preview }: { preview: ImportPreview }) {
  if (preview.parsed.length === 0) return null;
  const tests = new Map(preview.tests.map((t) => [t.name, t]));
  return (
    <TableCard
      asWritten
      headCellClass="px-3 py-2 font-semibold"
      caption="How the first values read (matched to the roster and the battery)"
      columns={PARSED_COLUMNS}
    >
      {preview.parsed.map((v) => (
        <tr key={`${v.row}|${v.column}`} className="border-b border-line last:border-0">
          <td className="num px-3 py-1.5 text-right text-ink-faint">{v.row}</td>
          <td className="px-3 py-1.5">{v.athleteName}</td>
          <td className="px-3 py-1.5">{v.testName}</td>
          <td className="num px-3 py-1.5 text-right">{v.trial}</td>
          <td className="num px-3 py-1.5 text-right">
            {scoreText(v.value, tests.get(v.testName))}{" "}
            <span className="text-ink-faint">{tests.get(v.testName)?.unit}</span>
          </td>
        </tr>
      ))}
    </TableCard>
  );
}
