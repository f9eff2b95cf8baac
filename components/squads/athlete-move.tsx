"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { DialogCancel } from "@/components/dialog";
import { Field, FormAlert } from "@/components/form-bits";
import { useUpdateAthlete } from "@/hooks/use-writes";
import { athleteQueries, type RosterAthlete, squadQueries } from "@/lib/client/queries";

/**
 * Moves an athlete to another squad, or adds them to a second one. The API takes the full
 * new list of squads, so the athlete's current squads (archived ones too) are read first and kept.
 */
export function AthleteMove({
  athlete,
  fromSquadId,
  onDone,
}: {
  athlete: RosterAthlete;
  fromSquadId: number;
  onDone: (message: string) => void;
}) {
  const squads = useQuery(squadQueries.list({ archived: true }));
  const membership = useQuery(athleteQueries.detail(athlete.id));
  const update = useUpdateAthlete();
  const list = squads.data ?? [];
  const [target, setTarget] = useState("");
  const [keep, setKeep] = useState(false);
  const failure = update.error ? update.error.message : null;

  const loading = squads.isPending || membership.isPending;
  const failed = squads.error ?? membership.error;
  const memberOf = new Set([fromSquadId, ...(membership.data?.squadIds ?? [])]);
  const current = list.filter((s) => memberOf.has(s.id));
  const targets = list.filter((s) => !s.archived && !current.some((c) => c.id === s.id));

  function move() {
    const targetId = Number(target);
    const ids = new Set(current.map((s) => s.id));
    if (!keep) ids.delete(fromSquadId);
    ids.add(targetId);
    const name = list.find((s) => s.id === targetId)?.name ?? "the squad";
    update.mutate(
      { athleteId: athlete.id, input: { squadIds: [...ids] } },
      {
        onSuccess: () =>
          onDone(keep ? `${athlete.name} was added to ${name} as well.` : `${athlete.name} was moved to ${name}.`),
      },
    );
  }

  if (loading || failed)
    return (
      <div className="space-y-3">
        {failed ? (
          <FormAlert message={`Squads could not load: ${failed.message}`} />
        ) : (
          <p role="status" className="text-sm text-ink-soft">
            Reading {athlete.name}&apos;s squads…
          </p>
        )}
        <div className="flex justify-end">
          <DialogCancel />
        </div>
      </div>
    );
  return (
    <div className="space-y-4">
      <p className="text-sm">
        {athlete.name} is in: <span className="font-semibold">{current.map((s) => s.name).join(", ")}</span>. Their
        results stay with the sessions they were recorded in.
      </p>
      {targets.length === 0 ? (
        <p className="text-sm text-ink-soft">There is no other squad you can move them to.</p>
      ) : (
        <>
          <Field id="move-target" label="Squad">
            <select id="move-target" className="field" value={target} onChange={(e) => setTarget(e.target.value)}>
              <option value="">Choose…</option>
              {targets.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </select>
          </Field>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={keep} onChange={(e) => setKeep(e.target.checked)} />
            Keep them in this squad too
          </label>
        </>
      )}
      <FormAlert message={failure} />
      <div className="flex flex-wrap justify-end gap-2">
        <DialogCancel />
        <button type="button" className="btn-primary" disabled={!target || update.isPending} onClick={move}>
          {update.isPending ? "Saving…" : keep ? "Add to squad" : "Move"}
        </button>
      </div>
    </div>
  );
}
