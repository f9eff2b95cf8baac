"use client";

import { keepPreviousData, useQuery, useSuspenseQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { QueryStatus } from "@/components/query-status";
import { type Column, TableCard } from "@/components/table-card";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";
import { PublishControl } from "./publish-control";
import { SessionCreateForm } from "./session-create-form";

const COLUMNS: Column[] = [
  { label: "Date" },
  { label: "Squad" },
  { label: "Phase" },
  { label: "Status" },
  { label: "Battery" },
  { label: "Results", align: "right" },
  { label: "Actions", srOnly: true },
];

/** Testing sessions of the caller's squads, newest first, with a squad filter and "New session". */
export function SessionList({ canPublish, initialSquadId }: { canPublish: boolean; initialSquadId: number | null }) {
  const router = useRouter();
  const [squadId, setSquadId] = useState<number | null>(initialSquadId);
  const [creating, setCreating] = useState(false);
  const { data: squads } = useSuspenseQuery(squadQueries.list());
  const { data: tests } = useSuspenseQuery(testQueries.list({ archived: true }));
  const sessions = useQuery({ ...sessionQueries.list({ squadId }), placeholderData: keepPreviousData });
  const testName = new Map(tests.map((t) => [t.id, t.name]));

  function chooseSquad(value: string) {
    const id = value ? Number(value) : null;
    setSquadId(id);
    router.replace(id ? `/sessions?squadId=${id}` : "/sessions", { scroll: false });
  }

  const list = [...(sessions.data ?? [])].sort((a, b) => b.date.localeCompare(a.date) || b.id - a.id);
  return (
    <section aria-labelledby="sessions-heading" className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <div>
          <h1 id="sessions-heading" className="text-2xl font-bold">
            Sessions
          </h1>
          <p className="text-sm text-ink-soft">
            Dated testing sessions. Open one to enter scores on its Session sheet.
          </p>
        </div>
        <div className="flex items-center gap-3">
          <label htmlFor="session-filter" className="text-sm font-semibold">
            Squad
          </label>
          <select
            id="session-filter"
            className="field w-auto"
            value={squadId ?? ""}
            onChange={(e) => chooseSquad(e.target.value)}
          >
            <option value="">All squads</option>
            {squads.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
          <button type="button" className="btn-primary" onClick={() => setCreating(true)}>
            New session
          </button>
        </div>
      </div>

      <QueryStatus
        query={sessions}
        loading="Loading sessions…"
        failure="Sessions could not load"
        empty={
          sessions.data &&
          list.length === 0 &&
          `No sessions yet${squadId ? " for this squad" : ""}. Create one with “New session”.`
        }
      />
      {list.length > 0 && (
        <TableCard columns={COLUMNS}>
          {list.map((s) => (
            <tr key={s.id} className="border-b border-line align-top last:border-0">
              <td className="num whitespace-nowrap px-3 py-2.5">
                <Link href={`/sessions/${s.id}`} className="font-semibold underline-offset-2 hover:underline">
                  {formatDate(s.date)}
                </Link>
              </td>
              <td className="whitespace-nowrap px-3 py-2.5">{s.squadName}</td>
              <td className="whitespace-nowrap px-3 py-2.5">{PHASE_LABELS[s.phase] ?? s.phase}</td>
              <td className="px-3 py-2.5">
                <span
                  className={`rounded px-1.5 py-0.5 text-xs font-semibold ${s.status === "published" ? "bg-ink text-white" : "bg-band text-ink"}`}
                >
                  {STATUS_LABELS[s.status]}
                </span>
              </td>
              <td className="min-w-40 px-3 py-2.5 text-ink-soft">
                {s.testIds.map((id) => testName.get(id) ?? `Test ${id}`).join(" · ")}
                {s.notes && <div className="text-xs text-ink-faint">{s.notes}</div>}
              </td>
              <td className="num px-3 py-2.5 text-right">{s.resultCount}</td>
              <td className="px-3 py-2.5">
                {/* Stacked on a tablet, so both buttons stay on screen beside the battery. */}
                <div className="flex flex-col items-stretch gap-1.5 whitespace-nowrap xl:flex-row xl:justify-end">
                  <Link href={`/sessions/${s.id}`} className="btn-quiet px-2 py-1 text-xs">
                    Session sheet
                  </Link>
                  {canPublish && (
                    <PublishControl
                      compact
                      sessionId={s.id}
                      status={s.status}
                      squadName={s.squadName}
                      version={s.version}
                    />
                  )}
                </div>
              </td>
            </tr>
          ))}
        </TableCard>
      )}

      <Dialog open={creating} wide title="New session" onClose={() => setCreating(false)}>
        {creating && (
          <SessionCreateForm
            squads={squads.filter((s) => !s.archived)}
            tests={tests.filter((t) => !t.archived)}
            defaultSquadId={squadId}
            onDone={(session) => {
              setCreating(false);
              router.push(`/sessions/${session.id}`);
            }}
          />
        )}
      </Dialog>
    </section>
  );
}
