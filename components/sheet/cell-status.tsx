"use client";

import type { CellState } from "@/hooks/use-session-sheet";

/** The small saved / saving / not saved mark beside a result. Colour is never the only signal. */
export function CellStatus({
  state,
  label,
  onRetry,
}: {
  state: CellState | undefined;
  label: string;
  onRetry: () => void;
}) {
  if (!state) return <span className="inline-block w-4" aria-hidden />;
  switch (state.status) {
    case "saving":
      return (
        <span role="status" aria-label={`Saving ${label}`} title="Saving…" className="inline-flex w-4 justify-center">
          <span className="h-2 w-2 animate-pulse rounded-full bg-ink-faint" />
        </span>
      );
    case "waiting":
      return (
        <span
          role="status"
          aria-label={`Waiting to send ${label}: no connection`}
          title="No connection: kept in this browser, sent when the network is back."
          className="inline-flex h-5 w-5 items-center justify-center rounded-full border border-dashed border-ink-soft text-[11px] font-bold text-ink-soft"
        >
          ⋯
        </span>
      );
    case "saved":
      return (
        <span
          role="status"
          aria-label={`Saved ${label}`}
          title="Saved"
          className="inline-flex w-4 justify-center text-sm font-bold text-steady"
        >
          ✓
        </span>
      );
    case "failed":
      return (
        <button
          type="button"
          onClick={onRetry}
          aria-label={`Not saved: ${label}. Retry`}
          title={`Not saved: ${state.message} Click to retry.`}
          className="inline-flex h-5 w-5 items-center justify-center rounded-full bg-decline text-xs font-bold text-white"
        >
          ↻
        </button>
      );
    case "conflict":
      return (
        <span
          role="status"
          aria-label={`Changed by ${state.current?.updatedByName ?? "someone else"}: ${label}`}
          title="Someone else changed this result; choose below."
          className="inline-flex h-5 w-5 items-center justify-center rounded-full border-2 border-decline text-xs font-bold text-decline"
        >
          !
        </span>
      );
  }
}
