"use client";

import { useQuery } from "@tanstack/react-query";
import { useMemo, useState } from "react";
import { DialogCancel } from "@/components/dialog";
import { Field, FormAlert } from "@/components/form-bits";
import { useAddAthlete } from "@/hooks/use-writes";
import { athleteQueries, type RosterAthlete } from "@/lib/client/queries";

/** Adds an athlete who is already in the organisation (e.g. moving up from the academy) to this squad. */
export function AddExistingAthlete({
  squadId,
  alreadyIn,
  onDone,
}: {
  squadId: number;
  alreadyIn: ReadonlySet<number>;
  onDone: (athlete: RosterAthlete) => void;
}) {
  const { data, isPending, error } = useQuery(athleteQueries.list());
  const [athleteId, setAthleteId] = useState("");
  const addAthlete = useAddAthlete(squadId);
  const failure = addAthlete.error ? addAthlete.error.message : null;
  const candidates = useMemo(() => (data ?? []).filter((a) => !alreadyIn.has(a.id)), [data, alreadyIn]);

  function add() {
    addAthlete.mutate({ athleteId: Number(athleteId) }, { onSuccess: onDone });
  }

  if (isPending || error || candidates.length === 0)
    return (
      <div className="space-y-3">
        {isPending ? (
          <p role="status" className="text-sm text-ink-soft">
            Loading athletes…
          </p>
        ) : error ? (
          <FormAlert message={`Athletes could not load: ${error.message}`} />
        ) : (
          <p className="text-sm text-ink-soft">Every athlete you can see is already in this squad.</p>
        )}
        <div className="flex justify-end">
          <DialogCancel />
        </div>
      </div>
    );
  return (
    <div className="space-y-3">
      <Field id="existing-athlete" label="Athlete">
        <select
          id="existing-athlete"
          className="field"
          value={athleteId}
          onChange={(e) => setAthleteId(e.target.value)}
        >
          <option value="">Choose…</option>
          {candidates.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
              {a.position ? ` · ${a.position}` : ""}
              {a.externalId ? ` · ${a.externalId}` : ""}
            </option>
          ))}
        </select>
      </Field>
      <FormAlert message={failure} />
      <div className="flex flex-wrap justify-end gap-2">
        <DialogCancel />
        <button type="button" className="btn-primary" disabled={!athleteId || addAthlete.isPending} onClick={add}>
          {addAthlete.isPending ? "Adding…" : "Add to squad"}
        </button>
      </div>
    </div>
  );
}
