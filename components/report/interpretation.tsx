"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { FormAlert } from "@/components/form-bits";
import { useSaveReport } from "@/hooks/use-writes";
import { reportQueries } from "@/lib/client/queries";
import { formatDate } from "@/lib/labels";
import type { ChangeReportQuery } from "@/lib/validation/reports";

/**
 * The scientist's interpretation note, saved with a snapshot of this report, and the squad's
 * saved reports. Coaches read them; owner and scientist write them.
 */
export function Interpretation({
  query,
  squadId,
  canWrite,
}: {
  query: ChangeReportQuery;
  squadId: number;
  canWrite: boolean;
}) {
  const [note, setNote] = useState("");
  const [saved, setSaved] = useState<number | null>(null);
  const save = useSaveReport();
  const list = useQuery(reportQueries.saved(squadId));

  function submit(event: React.FormEvent) {
    event.preventDefault();
    save.mutate(
      { ...query, note },
      {
        onSuccess: (report) => {
          setSaved(report.id);
          setNote("");
        },
      },
    );
  }

  return (
    <section aria-labelledby="interpretation-heading" className="card space-y-3 p-4 print:hidden">
      <h2 id="interpretation-heading" className="text-lg font-bold">
        Interpretation
      </h2>
      {canWrite && (
        <form onSubmit={submit} className="space-y-2">
          <label htmlFor="report-note" className="label">
            Note for the coaches (saved with every figure of this report as it stands now)
          </label>
          <textarea
            id="report-note"
            className="field"
            rows={3}
            maxLength={5000}
            value={note}
            onChange={(e) => setNote(e.target.value)}
          />
          <FormAlert message={save.error ? save.error.message : null} />
          <div className="flex items-center justify-end gap-3">
            {saved !== null && (
              <p role="status" className="text-sm">
                Saved.{" "}
                <Link href={`/reports/saved/${saved}`} className="font-semibold underline">
                  Open the saved report
                </Link>
              </p>
            )}
            <button type="submit" className="btn-primary" disabled={save.isPending || note.trim() === ""}>
              {save.isPending ? "Saving…" : "Save report with note"}
            </button>
          </div>
        </form>
      )}
      <div>
        <h3 className="font-semibold">Saved reports of this squad</h3>
        {list.error && <FormAlert message={`Saved reports could not load: ${list.error.message}`} />}
        {list.data && list.data.length === 0 && <p className="text-sm text-ink-soft">None yet.</p>}
        {list.data && list.data.length > 0 && (
          <ul className="mt-1 divide-y divide-line text-sm">
            {list.data.map((r) => (
              <li key={r.id} className="py-1.5">
                <Link href={`/reports/saved/${r.id}`} className="font-semibold underline-offset-2 hover:underline">
                  {r.testName}
                </Link>{" "}
                · saved {formatDate(new Date(r.createdAt).toISOString().slice(0, 10))}
                {r.authorName ? ` by ${r.authorName}` : ""}
                <span className="block truncate text-ink-soft">{r.note}</span>
              </li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}
