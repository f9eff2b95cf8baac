"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, FormAlert } from "@/components/form-bits";
import { useUpdateSquad } from "@/hooks/use-writes";
import { coachQueries, type SquadDetail } from "@/lib/client/queries";
import { squadCreateSchema } from "@/lib/validation/roster";

type Squad = SquadDetail["squad"];
type NameInput = z.infer<typeof squadCreateSchema>;

/** Owner only: rename the squad, choose its coaches, archive or restore it. */
export function SquadSettings({ squad, onSaved }: { squad: Squad; onSaved: (message: string) => void }) {
  return (
    <div className="space-y-6">
      <RenameForm squad={squad} onSaved={onSaved} />
      <CoachPicker squad={squad} onSaved={onSaved} />
      <ArchiveSquad squad={squad} onSaved={onSaved} />
    </div>
  );
}

function RenameForm({ squad, onSaved }: { squad: Squad; onSaved: (message: string) => void }) {
  const [failure, setFailure] = useState<string | null>(null);
  const update = useUpdateSquad(squad.id);
  const { register, handleSubmit, setError, formState } = useForm<
    z.input<typeof squadCreateSchema>,
    unknown,
    NameInput
  >({
    resolver: zodResolver(squadCreateSchema),
    defaultValues: { name: squad.name, sport: squad.sport ?? "" },
  });
  async function onSubmit(values: NameInput) {
    setFailure(null);
    try {
      await update.mutateAsync(values);
      onSaved(`The squad is now called ${values.name}.`);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, ["name", "sport"]));
    }
  }
  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-3">
      <h3 className="font-semibold">Name</h3>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="settings-name" label="Squad name" error={formState.errors.name?.message}>
          <input id="settings-name" className="field" {...register("name")} />
        </Field>
        <Field id="settings-sport" label="Sport" error={formState.errors.sport?.message}>
          <input id="settings-sport" className="field" {...register("sport")} />
        </Field>
      </div>
      <FormAlert message={failure} />
      <button type="submit" className="btn-quiet" disabled={formState.isSubmitting}>
        Rename
      </button>
    </form>
  );
}

function CoachPicker({ squad, onSaved }: { squad: Squad; onSaved: (message: string) => void }) {
  const { data, error, isPending } = useQuery(coachQueries.list());
  const [chosen, setChosen] = useState<Set<number>>(() => new Set(squad.coaches.map((c) => c.id)));
  const update = useUpdateSquad(squad.id);
  const failure = update.error ? update.error.message : null;

  function save() {
    update.mutate(
      { coachUserIds: [...chosen] },
      {
        onSuccess: () =>
          onSaved(chosen.size === 0 ? "The squad has no coach assigned now." : `Coaches saved (${chosen.size}).`),
      },
    );
  }

  return (
    <fieldset className="space-y-2">
      <legend className="font-semibold">Coaches</legend>
      <p className="text-sm text-ink-soft">Coaches see and edit only the squads they are assigned to.</p>
      {isPending && (
        <p role="status" className="text-sm text-ink-soft">
          Loading coaches…
        </p>
      )}
      {error && <FormAlert message={`Coaches could not load: ${error.message}`} />}
      {data && data.length === 0 && <p className="text-sm">No member has the coach role yet.</p>}
      {data && data.length > 0 && (
        <ul className="max-h-48 space-y-1 overflow-y-auto rounded-md border border-line p-2">
          {data.map((coach) => (
            <li key={coach.id}>
              <label className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={chosen.has(coach.id)}
                  onChange={(e) => {
                    const next = new Set(chosen);
                    if (e.target.checked) next.add(coach.id);
                    else next.delete(coach.id);
                    setChosen(next);
                  }}
                />
                <span className="font-semibold">{coach.name}</span>
                <span className="text-ink-faint">{coach.email}</span>
              </label>
            </li>
          ))}
        </ul>
      )}
      <FormAlert message={failure} />
      <button type="button" className="btn-quiet" disabled={update.isPending || !data} onClick={save}>
        Save coaches
      </button>
    </fieldset>
  );
}

function ArchiveSquad({ squad, onSaved }: { squad: Squad; onSaved: (message: string) => void }) {
  const [confirming, setConfirming] = useState(false);
  const update = useUpdateSquad(squad.id);
  const failure = update.error ? update.error.message : null;
  function toggle() {
    update.mutate(
      { archived: !squad.archived },
      {
        onSuccess: () => {
          onSaved(squad.archived ? `${squad.name} was restored.` : `${squad.name} was archived.`);
          setConfirming(false);
        },
      },
    );
  }
  return (
    <div className="space-y-2 border-t border-line pt-4">
      <h3 className="font-semibold">{squad.archived ? "Restore" : "Archive"}</h3>
      <p className="text-sm text-ink-soft">
        {squad.archived
          ? "Restoring brings the squad back into lists and new sessions."
          : "An archived squad keeps its athletes, sessions and results, but leaves the lists."}
      </p>
      <FormAlert message={failure} />
      {squad.archived ? (
        <button type="button" className="btn-quiet" onClick={toggle}>
          Restore squad
        </button>
      ) : confirming ? (
        <div className="flex items-center gap-2">
          <span className="text-sm">Archive {squad.name}?</span>
          <button type="button" className="btn-quiet" onClick={toggle}>
            Archive
          </button>
          <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>
            Cancel
          </button>
        </div>
      ) : (
        <button type="button" className="btn-quiet" onClick={() => setConfirming(true)}>
          Archive squad…
        </button>
      )}
    </div>
  );
}
