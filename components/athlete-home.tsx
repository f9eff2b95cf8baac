"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { type Column, TableCard } from "@/components/table-card";
import { athleteQueries } from "@/lib/client/queries";
import { FLAG_LABELS, formatDate, formatValue, PHASE_LABELS } from "@/lib/labels";

const COLUMNS: Column[] = [
  { label: "Date" },
  { label: "Session" },
  { label: "Test" },
  { label: "Result", align: "right" },
];

export function AthleteHome({ athleteId, name }: { athleteId: number | null; name: string }) {
  return (
    <section aria-labelledby="progress-heading" className="space-y-4">
      <h1 id="progress-heading" className="text-2xl font-bold">
        My progress
      </h1>
      <p className="text-ink-soft">
        Hello {name}. Your results appear here once your sport scientist publishes a testing session. You see only your
        own results; nobody else&apos;s.
      </p>
      {athleteId ? (
        <OwnResults athleteId={athleteId} />
      ) : (
        <p className="card p-4">Your account is not linked to an athlete record yet. Ask your coach to link it.</p>
      )}
      <p className="text-xs text-ink-faint">
        These numbers support training decisions; they are not a medical or return-to-play judgement. Talk to your
        medical staff about any health question.
      </p>
    </section>
  );
}

function OwnResults({ athleteId }: { athleteId: number }) {
  const { data: results } = useSuspenseQuery(athleteQueries.results(athleteId));
  if (results.length === 0) return <p className="card p-6 text-ink-soft">No published results yet.</p>;
  return (
    <TableCard columns={COLUMNS} headCellClass="px-4 py-2">
      {results.map((r) => (
        <tr key={r.id} className="border-b border-line last:border-0">
          <td className="px-4 py-2">{formatDate(r.date)}</td>
          <td className="px-4 py-2">{PHASE_LABELS[r.phase]}</td>
          <td className="px-4 py-2">{r.testName}</td>
          <td className="num px-4 py-2 text-right">
            {r.flag ? FLAG_LABELS[r.flag] : `${formatValue(r.value, r.decimals)} ${r.unit}`}
          </td>
        </tr>
      ))}
    </TableCard>
  );
}
