"use client";

import type { SessionSheetState } from "@/hooks/use-session-sheet";
import { ApiClientError } from "@/lib/client/fetch-json";

/** Undoes the caller's latest change to this session's scores, then reloads the sheet. */
export function UndoButton({ sheet, onMessage }: { sheet: SessionSheetState; onMessage: (message: string) => void }) {
  const { undo } = sheet;
  return (
    <button
      type="button"
      className="btn-quiet"
      disabled={undo.isPending || sheet.busy}
      onClick={() =>
        undo.mutate(undefined, {
          onSuccess: (undone) => {
            const athlete = sheet.data.athletes.find((a) => a.id === undone.athleteId)?.name ?? "an athlete";
            const test = sheet.data.tests.find((t) => t.id === undone.testId)?.name ?? "a test";
            onMessage(`Undid the last change: ${athlete} · ${test}.`);
          },
          onError: (error) => {
            if (error instanceof ApiClientError && error.status === 404)
              onMessage("Nothing of yours to undo in this session.");
            else if (error instanceof ApiClientError && error.status === 409)
              onMessage(`${error.message} That result was changed again since, so it was left as it is.`);
            else onMessage(`Undo failed: ${error.message}`);
          },
        })
      }
    >
      <span aria-hidden>↶</span> {undo.isPending ? "Undoing…" : "Undo last change"}
    </button>
  );
}
