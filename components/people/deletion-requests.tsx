"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import { useDeleteAthlete } from "@/hooks/use-writes";
import { type DeletionRequestItem, peopleQueries } from "@/lib/client/queries";
import { formatMoment } from "@/lib/labels";

export function DeletionRequests({
  requests,
  onNotice,
}: {
  requests: DeletionRequestItem[];
  onNotice: (message: string) => void;
}) {
  const [reviewing, setReviewing] = useState<DeletionRequestItem | null>(null);
  return (
    <section aria-labelledby="deletion-heading" className="card space-y-3 border-decline p-4">
      <h2 id="deletion-heading" className="text-lg font-bold">
        Deletion requests ({requests.length})
      </h2>
      <p className="text-sm text-ink-soft">
        These athletes asked for their data to be deleted. Check your own legal duties first (records you must keep),
        then delete: it removes the athlete and every row that refers to them, and cannot be undone.
      </p>
      <ul className="divide-y divide-line">
        {requests.map((request) => (
          <li key={request.id} className="flex flex-wrap items-start justify-between gap-3 py-2">
            <div className="text-sm">
              <p className="font-semibold">{request.athleteName}</p>
              <p className="text-ink-soft">Asked {formatMoment(request.requestedAt)}</p>
              {request.message && <p className="mt-1 whitespace-pre-line">“{request.message}”</p>}
            </div>
            <button type="button" className="btn-quiet" onClick={() => setReviewing(request)}>
              Review and delete…
            </button>
          </li>
        ))}
      </ul>
      <DeleteAthleteDialog
        athlete={reviewing && { id: reviewing.athleteId, name: reviewing.athleteName }}
        onClose={() => setReviewing(null)}
        onDeleted={(name) => {
          setReviewing(null);
          onNotice(`${name} and every row that referred to them were deleted.`);
        }}
      />
    </section>
  );
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The confirmation says what goes, counted, before anything is deleted. */
export function DeleteAthleteDialog({
  athlete,
  onClose,
  onDeleted,
}: {
  athlete: { id: number; name: string } | null;
  onClose: () => void;
  onDeleted: (name: string) => void;
}) {
  return (
    <Dialog open={athlete !== null} title={athlete ? `Delete ${athlete.name}?` : "Delete athlete"} onClose={onClose}>
      {athlete && <DeletePreview athlete={athlete} onClose={onClose} onDeleted={onDeleted} />}
    </Dialog>
  );
}

function DeletePreview({
  athlete,
  onClose,
  onDeleted,
}: {
  athlete: { id: number; name: string };
  onClose: () => void;
  onDeleted: (name: string) => void;
}) {
  const preview = useQuery(peopleQueries.deletionPreview(athlete.id));
  const remove = useDeleteAthlete();
  const counts = preview.data?.counts;
  return (
    <div className="space-y-3 text-sm">
      {preview.isPending && <p role="status">Counting what would be deleted…</p>}
      {preview.error && <FormAlert message={`The count could not load: ${preview.error.message}`} />}
      {counts && (
        <>
          <p>Deleting {athlete.name} removes, for good:</p>
          <ul className="list-disc space-y-0.5 pl-5">
            <li>the athlete record and {plural(counts.results, "result")}</li>
            <li>their place in {plural(counts.squads, "squad")}</li>
            {counts.account === "deleted" && <li>their Changewise account</li>}
            {counts.account === "kept-elsewhere" && (
              <li>their membership here (the account stays: it belongs to another organisation too)</li>
            )}
            {counts.invitations > 0 && <li>{plural(counts.invitations, "invitation")}</li>}
            {counts.deletionRequests > 0 && <li>their deletion request</li>}
            {counts.uploads > 0 && <li>{plural(counts.uploads, "imported file")} that name them</li>}
            {counts.auditEntries > 0 && (
              <li>{plural(counts.auditEntries, "entry", "entries")} in the change history</li>
            )}
            {counts.mails > 0 && <li>{plural(counts.mails, "mail")} in the outbox</li>}
          </ul>
          {(counts.savedReports > 0 || counts.reliabilityStudies > 0) && (
            <p>
              {counts.savedReports > 0 && `${plural(counts.savedReports, "saved report")} `}
              {counts.savedReports > 0 && counts.reliabilityStudies > 0 && "and "}
              {counts.reliabilityStudies > 0 &&
                `${plural(counts.reliabilityStudies, "reliability study", "reliability studies")} `}
              lose their row for {athlete.name}; their squad figures stay as they were saved. Notes that name them show
              “[deleted athlete]” instead.
            </p>
          )}
          <p className="font-semibold">This cannot be undone.</p>
        </>
      )}
      <FormAlert message={remove.error ? remove.error.message : null} />
      <div className="flex justify-end gap-2">
        <button type="button" className="btn-quiet" onClick={onClose}>
          Cancel
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!counts || remove.isPending}
          onClick={() => remove.mutate(athlete.id, { onSuccess: () => onDeleted(athlete.name) })}
        >
          {remove.isPending ? "Deleting…" : `Delete ${athlete.name} for good`}
        </button>
      </div>
    </div>
  );
}
