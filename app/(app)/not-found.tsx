import Link from "next/link";

export default function SignedInNotFound() {
  return (
    <div className="card mx-auto max-w-lg p-6 text-center">
      <h1 className="text-lg font-bold">Not found</h1>
      <p className="mt-2 text-sm text-ink-soft">It does not exist, or it is outside what your account can see.</p>
      <Link href="/" className="btn-quiet mt-4">
        Back to the start
      </Link>
    </div>
  );
}
