"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import { useDeleteSession } from "@/hooks/use-writes";
import { formatDate } from "@/lib/labels";

/** Deletes a draft session made by mistake, after a confirm step that says what goes with it. */
export function DeleteSession({
  sessionId,
  date,
  squadName,
  results,
}: {
  sessionId: number;
  date: string;
  squadName: string;
  /** Results the session holds as the screen shows it; the server refuses if that has changed. */
  results: number;
}) {
  const [open, setOpen] = useState(false);
  const remove = useDeleteSession();
  const router = useRouter();
  const what =
    results === 0
      ? "It holds no results yet."
      : `Its ${results} ${results === 1 ? "result goes" : "results go"} with it, with any imported file.`;

  return (
    <>
      <button
        type="button"
        className="btn-quiet"
        onClick={() => {
          remove.reset();
          setOpen(true);
        }}
      >
        Delete draft…
      </button>
      <Dialog open={open} title="Delete this draft session?" onClose={() => setOpen(false)}>
        <div className="space-y-3 text-sm">
          <p>
            <strong>
              {squadName}, {formatDate(date)}
            </strong>
            . {what} Deleting cannot be undone; the change log keeps a note that it happened.
          </p>
          <FormAlert message={remove.error ? remove.error.message : null} />
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet" onClick={() => setOpen(false)}>
              Cancel
            </button>
            <button
              type="button"
              className="btn-danger"
              disabled={remove.isPending}
              onClick={() =>
                remove.mutate({ sessionId, confirmedResults: results }, { onSuccess: () => router.push("/sessions") })
              }
            >
              {remove.isPending
                ? "Deleting…"
                : results === 0
                  ? "Delete session"
                  : `Delete session and ${results === 1 ? "its result" : `${results} results`}`}
            </button>
          </div>
        </div>
      </Dialog>
    </>
  );
}
