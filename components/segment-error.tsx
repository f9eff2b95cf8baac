"use client";

import Link from "next/link";

/** The error boundary body for every staff segment: says nothing was changed, offers to try again. */
export function SegmentError({ what, error, retry }: { what: string; error: unknown; retry: () => void }) {
  const digest = error instanceof Error && "digest" in error ? String((error as { digest?: string }).digest ?? "") : "";
  return (
    <div role="alert" className="card mx-auto max-w-lg p-6 text-center">
      <h1 className="text-lg font-bold">{what} could not load</h1>
      <p className="mt-2 text-sm text-ink-soft">
        Nothing was changed. Check the connection and try again.{digest ? ` Reference ${digest}.` : ""}
      </p>
      <div className="mt-4 flex justify-center gap-2">
        <button type="button" className="btn-primary" onClick={() => retry()}>
          Try again
        </button>
        <Link href="/" className="btn-quiet">
          Back to Squads
        </Link>
      </div>
    </div>
  );
}
