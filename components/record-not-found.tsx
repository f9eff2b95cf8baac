import Link from "next/link";
import { guard } from "@/lib/auth/guard";
import { isAthlete } from "@/lib/auth/permissions";

/**
 * Not-found body for a record page; never says whether the record exists elsewhere. The way
 * back is one the viewer can open: an athlete is sent to My progress, never to a staff screen.
 */
export async function RecordNotFound({ what, back, backLabel }: { what: string; back: string; backLabel: string }) {
  const actor = await guard().catch(() => null);
  const athlete = actor !== null && isAthlete(actor);
  return (
    <div className="card mx-auto max-w-lg p-6 text-center">
      <h1 className="text-lg font-bold">{what} not found</h1>
      <p className="mt-2 text-sm text-ink-soft">It does not exist, or it is outside what your account can see.</p>
      <Link href={athlete ? "/" : back} className="btn-quiet mt-4">
        {athlete ? "Back to My progress" : backLabel}
      </Link>
    </div>
  );
}
