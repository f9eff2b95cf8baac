import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="text-sm font-semibold uppercase tracking-wide text-ink-faint">404</p>
      <h1 className="mt-2 text-3xl font-bold">Nothing here</h1>
      <p className="mt-3 text-ink-soft">The page does not exist, or it is outside what your account can see.</p>
      <Link href="/" className="btn-primary mt-8">
        Back to Changewise
      </Link>
    </main>
  );
}
