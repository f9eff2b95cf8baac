"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { isCoach } from "@/lib/auth/permissions";
import { squadQueries } from "@/lib/client/queries";
import type { Role } from "@/lib/domain";
import { formatDate, PHASE_LABELS } from "@/lib/labels";
import { SquadCreateForm } from "./squad-create-form";
import { SquadsStatus } from "./squads-status";

/** Roster entry point: pick a squad. The owner may create one. */
export function SquadList({ role, canCreate }: { role: Role; canCreate: boolean }) {
  const [showArchived, setShowArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const router = useRouter();
  // The page prefetched the active squads; the archived ones are read when asked for.
  const squads = useQuery({ ...squadQueries.list({ archived: showArchived }), placeholderData: keepPreviousData });

  return (
    <section aria-labelledby="roster-heading" className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <div>
          <h1 id="roster-heading" className="text-2xl font-bold">
            Roster
          </h1>
          <p className="text-sm text-ink-soft">
            {isCoach({ role })
              ? "Open one of your squads to see and change its athletes."
              : "Open a squad to see and change its athletes."}
          </p>
        </div>
        <div className="flex items-center gap-3">
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
            Show archived squads
          </label>
          {canCreate && (
            <button type="button" className="btn-primary" onClick={() => setCreating(true)}>
              New squad
            </button>
          )}
        </div>
      </div>

      <SquadsStatus query={squads} role={role} />
      {squads.data && squads.data.length > 0 && (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {squads.data.map((squad) => (
            <li key={squad.id}>
              <Link
                href={`/squads/${squad.id}`}
                className={`card block p-4 hover:border-ink-faint ${squad.archived ? "bg-paper text-ink-faint" : ""}`}
              >
                <span className="flex items-baseline justify-between gap-2">
                  <span className="text-lg font-bold">{squad.name}</span>
                  {squad.archived && (
                    <span className="rounded bg-steady-soft px-1.5 py-0.5 text-xs text-ink-soft">Archived</span>
                  )}
                </span>
                <span className="block text-sm text-ink-soft">
                  {squad.sport ?? "No sport given"} · <span className="num">{squad.athleteCount}</span> athletes
                </span>
                <span className="mt-1 block text-xs text-ink-faint">
                  {squad.latestSession
                    ? `Latest session ${formatDate(squad.latestSession.date)} · ${PHASE_LABELS[squad.latestSession.phase]}`
                    : "No sessions yet"}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}

      <Dialog open={creating} title="New squad" onClose={() => setCreating(false)}>
        <SquadCreateForm
          onDone={(squad) => {
            setCreating(false);
            router.push(`/squads/${squad.id}`);
          }}
        />
      </Dialog>
    </section>
  );
}
