"use client";

import { keepPreviousData, useQuery, useSuspenseQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { QueryStatus } from "@/components/query-status";
import { type Column, PhoneFacts, TableCard, WIDE_ONLY } from "@/components/table-card";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";
import { PublishControl } from "./publish-control";
import { SessionCreateForm } from "./session-create-form";

const COLUMNS: Column[] = [
  { label: "Date" },
  { label: "Squad", className: WIDE_ONLY },
  { label: "Phase", className: WIDE_ONLY },
  { label: "Status", className: WIDE_ONLY },
  { label: "Battery", className: WIDE_ONLY },
  { label: "Results", align: "right", className: WIDE_ONLY },
  { label: "Actions", srOnly: true, className: WIDE_ONLY },
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
        <div className="flex flex-wrap items-center gap-3">
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
          {list.map((s) => {
            const phase = PHASE_LABELS[s.phase] ?? s.phase;
            const status = (
              <span
                className={`rounded px-1.5 py-0.5 text-xs font-semibold ${s.status === "published" ? "bg-ink text-white" : "bg-band text-ink"}`}
              >
                {STATUS_LABELS[s.status]}
              </span>
            );
            const battery = (
              <>
                {s.testIds.map((id) => testName.get(id) ?? `Test ${id}`).join(" · ")}
                {s.notes && <span className="block text-xs text-ink-soft">{s.notes}</span>}
              </>
            );
            const results = <span className="num">{s.resultCount}</span>;
            const actions = (
              // Stacked on a tablet, so both buttons stay on screen beside the battery; wrapping on a phone.
              <div className="flex flex-wrap gap-1.5 whitespace-nowrap sm:flex-col sm:items-stretch xl:flex-row xl:justify-end">
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
            );
            return (
              <tr key={s.id} className="border-b border-line align-top last:border-0">
                <td className="px-3 py-2.5">
                  <Link
                    href={`/sessions/${s.id}`}
                    className="num whitespace-nowrap font-semibold underline-offset-2 hover:underline"
                  >
                    {formatDate(s.date)}
                  </Link>
                  <span className="ml-2 font-semibold sm:hidden">{s.squadName}</span>
                  <PhoneFacts
                    facts={[
                      { label: "Phase", value: phase },
                      { label: "Status", value: status },
                      { label: "Battery", value: battery },
                      { label: "Results", value: results },
                    ]}
                    actions={actions}
                  />
                </td>
                <td className={`whitespace-nowrap px-3 py-2.5 ${WIDE_ONLY}`}>{s.squadName}</td>
                <td className={`whitespace-nowrap px-3 py-2.5 ${WIDE_ONLY}`}>{phase}</td>
                <td className={`px-3 py-2.5 ${WIDE_ONLY}`}>{status}</td>
                <td className={`min-w-40 px-3 py-2.5 text-ink-soft ${WIDE_ONLY}`}>{battery}</td>
                <td className={`px-3 py-2.5 text-right ${WIDE_ONLY}`}>{results}</td>
                <td className={`px-3 py-2.5 ${WIDE_ONLY}`}>{actions}</td>
              </tr>
            );
          })}
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
