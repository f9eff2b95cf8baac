"use client";

export default function AuthError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="card p-6 text-center" role="alert">
      <p className="font-semibold">The sign-in page could not load.</p>
      <button type="button" className="btn-quiet mt-4" onClick={() => reset()}>
        Try again
      </button>
    </div>
  );
}
