"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import Link from "next/link";
import { SquadsStatus } from "@/components/squads/squads-status";
import { WorkToDoPanel } from "@/components/squads/work-to-do";
import { type Column, TableCard } from "@/components/table-card";
import { isCoach } from "@/lib/auth/permissions";
import { squadQueries } from "@/lib/client/queries";
import type { Role } from "@/lib/domain";
import { formatDate, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";

const COLUMNS: Column[] = [
  { label: "Squad" },
  { label: "Athletes", align: "right" },
  { label: "Latest session" },
  { label: "Status" },
];

export function SquadsOverview({ role }: { role: Role }) {
  const squads = useSuspenseQuery(squadQueries.list());

  return (
    <section aria-labelledby="squads-heading" className="space-y-4">
      <div className="flex items-baseline justify-between">
        <h1 id="squads-heading" className="text-2xl font-bold">
          Squads
        </h1>
        <p className="text-sm text-ink-soft">
          {isCoach({ role }) ? "The squads you coach" : "Every squad in your organisation"}
        </p>
      </div>
      <SquadsStatus query={squads} role={role} />
      {squads.data.length > 0 && <WorkToDoPanel />}
      {squads.data.length > 0 && (
        <TableCard columns={COLUMNS} headCellClass="px-4 py-2 font-semibold">
          {squads.data.map((squad) => (
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
                    {formatDate(squad.latestSession.date)} · {PHASE_LABELS[squad.latestSession.phase]}
                  </Link>
                ) : (
                  <span className="text-ink-faint">No sessions yet</span>
                )}
              </td>
              <td className="px-4 py-3">{squad.latestSession ? STATUS_LABELS[squad.latestSession.status] : "–"}</td>
            </tr>
          ))}
        </TableCard>
      )}
    </section>
  );
}
