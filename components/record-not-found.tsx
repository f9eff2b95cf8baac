import Link from "next/link";

/** Not-found body for a record page; never says whether the record exists elsewhere. */
export function RecordNotFound({ what, back, backLabel }: { what: string; back: string; backLabel: string }) {
  return (
    <div className="card mx-auto max-w-lg p-6 text-center">
      <h1 className="text-lg font-bold">{what} not found</h1>
      <p className="mt-2 text-sm text-ink-soft">It does not exist, or it is outside what your account can see.</p>
      <Link href={back} className="btn-quiet mt-4">
        {backLabel}
      </Link>
    </div>
  );
}
