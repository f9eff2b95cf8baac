"use client";

import { TableCard, type Column } from "@/components/table-card";
import type { Phase, ResultFlag } from "@/lib/domain";
import type { AthleteResult } from "@/lib/client/api-types";
import { useApi } from "@/hooks/use-api";
import { FLAG_LABELS, PHASE_LABELS, formatDate, formatValue } from "@/lib/labels";

const COLUMNS: Column[] = [{ label: "Date" }, { label: "Session" }, { label: "Test" }, { label: "Result", align: "right" }];

export function AthleteHome({ athleteId, name }: { athleteId: number | null; name: string }) {
  const { data, error, isPending } = useApi<{ results: AthleteResult[] }>(
    athleteId ? `/api/athletes/${athleteId}/results` : null,
  );

  return (
    <section aria-labelledby="progress-heading" className="space-y-4">
      <h1 id="progress-heading" className="text-2xl font-bold">My progress</h1>
      <p className="text-ink-soft">
        Hello {name}. Your results appear here once your sport scientist publishes a testing session. You see only
        your own results; nobody else&apos;s.
      </p>
      {!athleteId && (
        <p className="card p-4">Your account is not linked to an athlete record yet. Ask your coach to link it.</p>
      )}
      {isPending && athleteId && <p role="status" className="text-ink-soft">Loading your results…</p>}
      {error && <p role="alert" className="card p-4">Your results could not load: {error.message}</p>}
      {data && data.results.length === 0 && (
        <p className="card p-6 text-ink-soft">No published results yet.</p>
      )}
      {data && data.results.length > 0 && (
        <TableCard columns={COLUMNS} headCellClass="px-4 py-2">
          {data.results.map((r) => (
            <tr key={r.id} className="border-b border-line last:border-0">
              <td className="px-4 py-2">{formatDate(r.date)}</td>
              <td className="px-4 py-2">{PHASE_LABELS[r.phase as Phase]}</td>
              <td className="px-4 py-2">{r.testName}</td>
              <td className="num px-4 py-2 text-right">
                {r.flag ? FLAG_LABELS[r.flag as ResultFlag] : `${formatValue(r.value, r.decimals)} ${r.unit}`}
              </td>
            </tr>
          ))}
        </TableCard>
      )}
      <p className="text-xs text-ink-faint">
        These numbers support training decisions; they are not a medical or return-to-play judgement. Talk to your
        medical staff about any health question.
      </p>
    </section>
  );
}
