"use client";

import Link from "next/link";
import type { Role } from "@/db/schema";
import { useApi } from "@/hooks/use-api";
import type { SquadSummary } from "@/lib/data/squads";
import { PHASE_LABELS, STATUS_LABELS, formatDate } from "@/lib/labels";
import type { Phase, SessionStatus } from "@/db/schema";

export function SquadsOverview({ role }: { role: Role }) {
  const { data, error, isPending, refetch } = useApi<{ squads: SquadSummary[] }>("/api/squads");

  return (
    <section aria-labelledby="squads-heading">
      <div className="mb-4 flex items-baseline justify-between">
        <h1 id="squads-heading" className="text-2xl font-bold">Squads</h1>
        <p className="text-sm text-ink-soft">
          {role === "coach" ? "The squads you coach" : "Every squad in your organisation"}
        </p>
      </div>
      {isPending && <p role="status" className="text-ink-soft">Loading squads…</p>}
      {error && (
        <div role="alert" className="card p-4">
          <p className="font-semibold">Squads could not load: {error.message}</p>
          <button className="btn-quiet mt-2" onClick={() => refetch()}>Try again</button>
        </div>
      )}
      {data && data.squads.length === 0 && (
        <p className="card p-6 text-ink-soft">
          {role === "coach" ? "You are not assigned to a squad yet. Ask your head of performance to add you." : "No squads yet."}
        </p>
      )}
      {data && data.squads.length > 0 && (
        <div className="card overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-line text-xs uppercase tracking-wide text-ink-faint">
              <tr>
                <th className="px-4 py-2 font-semibold">Squad</th>
                <th className="px-4 py-2 text-right font-semibold">Athletes</th>
                <th className="px-4 py-2 font-semibold">Latest session</th>
                <th className="px-4 py-2 font-semibold">Status</th>
              </tr>
            </thead>
            <tbody>
              {data.squads.map((squad) => (
                <tr key={squad.id} className="border-b border-line last:border-0">
                  <td className="px-4 py-3">
                    <Link href={`/squads/${squad.id}`} className="font-semibold underline-offset-2 hover:underline">
                      {squad.name}
                    </Link>
                    {squad.sport && <span className="ml-2 text-ink-faint">{squad.sport}</span>}
                  </td>
                  <td className="num px-4 py-3 text-right">{squad.athleteCount}</td>
                  <td className="px-4 py-3">
                    {squad.latestSession ? (
                      <Link href={`/sessions/${squad.latestSession.id}`} className="underline-offset-2 hover:underline">
                        {formatDate(squad.latestSession.date)} · {PHASE_LABELS[squad.latestSession.phase as Phase]}
                      </Link>
                    ) : (
                      <span className="text-ink-faint">No sessions yet</span>
                    )}
                  </td>
                  <td className="px-4 py-3">
                    {squad.latestSession ? STATUS_LABELS[squad.latestSession.status as SessionStatus] : "–"}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
