"use client";

import { keepPreviousData, useQuery, useSuspenseQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useMemo, useState } from "react";
import { Breadcrumbs } from "@/components/breadcrumbs";
import { Dialog, DialogCancel } from "@/components/dialog";
import { LoadFailure } from "@/components/query-status";
import { useUpdateAthlete } from "@/hooks/use-writes";
import { type RosterAthlete, squadQueries } from "@/lib/client/queries";
import { AddExistingAthlete } from "./add-existing-athlete";
import { AthleteForm } from "./athlete-form";
import { AthleteMove } from "./athlete-move";
import { AthleteTable } from "./athlete-table";
import { SquadSettings } from "./squad-settings";

type Panel =
  | { kind: "add" }
  | { kind: "edit"; athlete: RosterAthlete }
  | { kind: "move"; athlete: RosterAthlete }
  | { kind: "settings" }
  | null;

/** The Roster of one squad: its athletes, and for the owner the squad itself. */
export function Roster({ squadId }: { squadId: number }) {
  const [showArchived, setShowArchived] = useState(false);
  const [panel, setPanel] = useState<Panel>(null);
  const [addMode, setAddMode] = useState<"new" | "existing">("new");
  const [notice, setNotice] = useState<string | null>(null);
  const { data: detail } = useSuspenseQuery(squadQueries.detail(squadId));
  const athletes = useQuery({
    ...squadQueries.roster(squadId, { archived: showArchived }),
    placeholderData: keepPreviousData,
  });
  const update = useUpdateAthlete();
  const memberIds = useMemo(() => new Set((athletes.data ?? []).map((a) => a.id)), [athletes.data]);

  function done(message: string) {
    setNotice(message);
    setPanel(null);
  }

  function setArchived(athlete: RosterAthlete, archived: boolean) {
    update.mutate(
      { athleteId: athlete.id, input: { archived } },
      {
        onSuccess: () =>
          done(archived ? `${athlete.name} was archived; their results are kept.` : `${athlete.name} was restored.`),
        onError: (error) => setNotice(`${athlete.name}: ${error.message}`),
      },
    );
  }

  const { squad } = detail;
  return (
    <section aria-labelledby="squad-heading" className="space-y-4">
      <Breadcrumbs trail={[{ href: "/", label: "Squads" }, { label: squad.name }]} />
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 id="squad-heading" className="text-2xl font-bold">
            {squad.name}
            {squad.archived && (
              <span className="ml-2 rounded bg-steady-soft px-1.5 py-0.5 align-middle text-xs text-ink-soft">
                Archived
              </span>
            )}
          </h1>
          <p className="text-sm text-ink-soft">
            {squad.sport ?? "No sport given"} · Coaches:{" "}
            {squad.coaches.length > 0 ? squad.coaches.map((c) => c.name).join(", ") : "none assigned"}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link href={`/sessions?squadId=${squadId}`} className="btn-quiet">
            Sessions
          </Link>
          {detail.canManage && (
            <button type="button" className="btn-quiet" onClick={() => setPanel({ kind: "settings" })}>
              Squad settings
            </button>
          )}
          {detail.canEditRoster && (
            <button type="button" className="btn-primary" onClick={() => setPanel({ kind: "add" })}>
              Add athlete
            </button>
          )}
        </div>
      </div>

      {notice && (
        <p role="status" className="rounded-md border border-line bg-band px-3 py-2 text-sm">
          {notice}
        </p>
      )}
      {athletes.error && (
        <LoadFailure failure="The Roster could not load" error={athletes.error} onRetry={athletes.refetch} />
      )}
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
        Show archived athletes
      </label>
      {athletes.data && (
        <AthleteTable
          athletes={athletes.data}
          renderActions={(a) => (
            <div className="flex flex-wrap gap-1.5 sm:flex-nowrap sm:justify-end">
              <button
                type="button"
                className="btn-quiet px-2 py-1 text-xs"
                aria-label={`Edit ${a.name}`}
                onClick={() => setPanel({ kind: "edit", athlete: a })}
              >
                Edit
              </button>
              <button
                type="button"
                className="btn-quiet px-2 py-1 text-xs"
                aria-label={`Move ${a.name}`}
                onClick={() => setPanel({ kind: "move", athlete: a })}
              >
                Move
              </button>
              <button
                type="button"
                className="btn-quiet px-2 py-1 text-xs"
                aria-label={`${a.archived ? "Restore" : "Archive"} ${a.name}`}
                onClick={() => setArchived(a, !a.archived)}
              >
                {a.archived ? "Restore" : "Archive"}
              </button>
            </div>
          )}
        />
      )}

      <Dialog open={panel?.kind === "add"} title={`Add an athlete to ${squad.name}`} onClose={() => setPanel(null)}>
        <div role="tablist" aria-label="How to add" className="mb-4 flex gap-2">
          {(["new", "existing"] as const).map((mode) => (
            <button
              key={mode}
              type="button"
              role="tab"
              aria-selected={addMode === mode}
              className={`rounded-md px-3 py-1.5 text-sm font-semibold ${addMode === mode ? "bg-ink text-white" : "bg-band text-ink"}`}
              onClick={() => setAddMode(mode)}
            >
              {mode === "new" ? "New athlete" : "Already in the organisation"}
            </button>
          ))}
        </div>
        {addMode === "new" ? (
          <AthleteForm squadId={squadId} athlete={null} onDone={(a) => done(`${a.name} was added.`)} />
        ) : (
          <AddExistingAthlete squadId={squadId} alreadyIn={memberIds} onDone={(a) => done(`${a.name} was added.`)} />
        )}
      </Dialog>
      <Dialog
        open={panel?.kind === "edit"}
        title={panel?.kind === "edit" ? `Edit ${panel.athlete.name}` : ""}
        onClose={() => setPanel(null)}
      >
        {panel?.kind === "edit" && (
          <AthleteForm
            key={panel.athlete.id}
            squadId={squadId}
            athlete={panel.athlete}
            onDone={(a) => done(`${a.name} was saved.`)}
          />
        )}
      </Dialog>
      <Dialog
        open={panel?.kind === "move"}
        title={panel?.kind === "move" ? `Move ${panel.athlete.name}` : ""}
        onClose={() => setPanel(null)}
      >
        {panel?.kind === "move" && <AthleteMove athlete={panel.athlete} fromSquadId={squadId} onDone={done} />}
      </Dialog>
      <Dialog open={panel?.kind === "settings"} title="Squad settings" onClose={() => setPanel(null)}>
        {panel?.kind === "settings" && <SquadSettings squad={squad} onSaved={done} />}
        {/* Each part above saves on its own button, so leaving loses nothing saved: Done, not Cancel. */}
        <div className="mt-6 flex justify-end border-t border-line pt-4">
          <DialogCancel label="Done" />
        </div>
      </Dialog>
    </section>
  );
}
