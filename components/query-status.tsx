"use client";

import type { ReactNode } from "react";

/** What a React Query result offers that the status lines need. */
export type QueryState = { isPending: boolean; error: Error | null; refetch: () => unknown };

/** A failed read, with a button to read again. */
export function LoadFailure({ failure, error, onRetry }: { failure: string; error: Error; onRetry: () => unknown }) {
  return (
    <div role="alert" className="card p-4">
      <p className="font-semibold">
        {failure}: {error.message}
      </p>
      <button type="button" className="btn-quiet mt-2" onClick={() => onRetry()}>
        Try again
      </button>
    </div>
  );
}

/**
 * Failure with retry, and the empty state of a list query. The loading line shows only before the
 * first data arrives, which on a prefetched page never happens: the segment's skeleton covers it.
 * `failure` reads "… could not load"; pass `empty` only when the loaded list is empty.
 */
export function QueryStatus({
  query,
  loading,
  failure,
  empty,
}: {
  query: QueryState;
  loading: string;
  failure: string;
  empty?: ReactNode;
}) {
  return (
    <>
      {query.isPending && (
        <p role="status" className="text-ink-soft">
          {loading}
        </p>
      )}
      {query.error && <LoadFailure failure={failure} error={query.error} onRetry={query.refetch} />}
      {empty && <p className="card p-6 text-ink-soft">{empty}</p>}
    </>
  );
}
