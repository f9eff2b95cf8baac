"use client";

export default function SignedInError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="card mx-auto max-w-lg p-6 text-center">
      <h1 className="text-lg font-bold">This page could not load</h1>
      <p className="mt-2 text-sm text-ink-soft">
        Nothing was changed. {error.digest ? `Reference ${error.digest}.` : ""}
      </p>
      <button type="button" className="btn-primary mt-4" onClick={() => reset()}>
        Try again
      </button>
    </div>
  );
}
