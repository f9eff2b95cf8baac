"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { SquadCreateForm } from "@/components/squads/squad-create-form";
import { SquadsStatus } from "@/components/squads/squads-status";
import { WorkToDoPanel } from "@/components/squads/work-to-do";
import { type Column, PhoneFacts, TableCard, WIDE_ONLY } from "@/components/table-card";
import { isCoach } from "@/lib/auth/permissions";
import { type SquadSummary, squadQueries } from "@/lib/client/queries";
import type { Role } from "@/lib/domain";
import { formatDate, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";

const COLUMNS: Column[] = [
  { label: "Squad" },
  { label: "Athletes", align: "right", className: WIDE_ONLY },
  { label: "Latest session", className: WIDE_ONLY },
  { label: "Status", className: WIDE_ONLY },
];

/** Squads, the staff home: each squad with what needs doing; the owner creates squads here. */
export function SquadsOverview({ role, canCreate }: { role: Role; canCreate: boolean }) {
  const [showArchived, setShowArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const router = useRouter();
  // The page prefetched the active squads; the archived ones are read when asked for.
  const squads = useQuery({ ...squadQueries.list({ archived: showArchived }), placeholderData: keepPreviousData });
  const list = squads.data ?? [];

  return (
    <section aria-labelledby="squads-heading" className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="squads-heading" className="text-2xl font-bold">
            Squads
          </h1>
          <p className="text-sm text-ink-soft">
            {isCoach({ role })
              ? "The squads you coach. Open one for its Roster."
              : "Every squad in your organisation. Open one for its Roster."}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-3">
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
      {list.length > 0 && <WorkToDoPanel />}
      {list.length > 0 && (
        <TableCard columns={COLUMNS} headCellClass="px-4 py-2 font-semibold">
          {list.map((squad) => (
            <SquadRow key={squad.id} squad={squad} />
          ))}
        </TableCard>
      )}

      <Dialog open={creating} title="New squad" onClose={() => setCreating(false)}>
        {creating && (
          <SquadCreateForm
            onDone={(squad) => {
              setCreating(false);
              router.push(`/squads/${squad.id}`);
            }}
          />
        )}
      </Dialog>
    </section>
  );
}

function SquadRow({ squad }: { squad: SquadSummary }) {
  const latest = squad.latestSession;
  const athletes = <span className="num">{squad.athleteCount}</span>;
  const session = latest ? (
    <Link href={`/sessions/${latest.id}`} className="underline-offset-2 hover:underline">
      {formatDate(latest.date)} · {PHASE_LABELS[latest.phase]}
    </Link>
  ) : (
    <span className="text-ink-soft">No sessions yet</span>
  );
  const status = latest ? STATUS_LABELS[latest.status] : "–";
  return (
    <tr className={`border-b border-line last:border-0 ${squad.archived ? "bg-paper" : ""}`}>
      <td className="px-4 py-3">
        <Link href={`/squads/${squad.id}`} className="font-semibold underline-offset-2 hover:underline">
          {squad.name}
        </Link>
        {squad.sport && <span className="ml-2 text-ink-soft">{squad.sport}</span>}
        {squad.archived && (
          <span className="ml-2 rounded bg-steady-soft px-1.5 py-0.5 text-xs text-ink-soft">Archived</span>
        )}
        <PhoneFacts
          facts={[
            { label: "Athletes", value: athletes },
            { label: "Latest session", value: session },
            ...(latest ? [{ label: "Status", value: status }] : []),
          ]}
        />
      </td>
      <td className={`px-4 py-3 text-right ${WIDE_ONLY}`}>{athletes}</td>
      <td className={`px-4 py-3 ${WIDE_ONLY}`}>{session}</td>
      <td className={`px-4 py-3 ${WIDE_ONLY}`}>{status}</td>
    </tr>
  );
}
