"use client";

import { useMemo, useState } from "react";
import { Field, FormAlert } from "@/components/form-bits";
import type { AthleteListItem, RosterAthlete } from "@/lib/client/api-types";
import { fetchJson, useApi } from "@/hooks/use-api";

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
  const { data, isPending, error } = useApi<{ athletes: AthleteListItem[] }>("/api/athletes");
  const [athleteId, setAthleteId] = useState("");
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const candidates = useMemo(() => (data?.athletes ?? []).filter((a) => !alreadyIn.has(a.id)), [data, alreadyIn]);

  async function add() {
    setBusy(true);
    setFailure(null);
    try {
      const { athlete } = await fetchJson<{ athlete: RosterAthlete }>(`/api/squads/${squadId}/athletes`, {
        method: "POST",
        body: JSON.stringify({ athleteId: Number(athleteId) }),
      });
      onDone(athlete);
    } catch (e) {
      setFailure(e instanceof Error ? e.message : "The athlete could not be added.");
    } finally {
      setBusy(false);
    }
  }

  if (isPending) return <p role="status" className="text-sm text-ink-soft">Loading athletes…</p>;
  if (error) return <FormAlert message={`Athletes could not load: ${error.message}`} />;
  if (candidates.length === 0) return <p className="text-sm text-ink-soft">Every athlete you can see is already in this squad.</p>;
  return (
    <div className="space-y-3">
      <Field id="existing-athlete" label="Athlete">
        <select id="existing-athlete" className="field" value={athleteId} onChange={(e) => setAthleteId(e.target.value)}>
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
      <div className="flex justify-end">
        <button type="button" className="btn-primary" disabled={!athleteId || busy} onClick={add}>
          {busy ? "Adding…" : "Add to squad"}
        </button>
      </div>
    </div>
  );
}
