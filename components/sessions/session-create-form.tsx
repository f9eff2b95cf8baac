"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, FieldError, SubmitRow } from "@/components/form-bits";
import { useCreateSession } from "@/hooks/use-writes";
import type { SquadSummary, TestItem } from "@/lib/client/queries";
import { PHASES } from "@/lib/domain";
import { PHASE_LABELS } from "@/lib/labels";
import { type SessionCreateInput, sessionCreateSchema } from "@/lib/validation/sessions";
import { BatteryPicker } from "./battery-picker";

const FIELDS = ["squadId", "date", "phase", "testIds", "notes"] as const;

function today() {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;
}

/** A dated testing session for one squad, with its battery of tests. */
export function SessionCreateForm({
  squads,
  tests,
  defaultSquadId,
  onDone,
}: {
  squads: SquadSummary[];
  tests: TestItem[];
  defaultSquadId: number | null;
  onDone: (session: { id: number }) => void;
}) {
  const [failure, setFailure] = useState<string | null>(null);
  const create = useCreateSession();
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof sessionCreateSchema>, unknown, SessionCreateInput>({
    resolver: zodResolver(sessionCreateSchema),
    defaultValues: {
      squadId: defaultSquadId ?? (squads.length === 1 ? squads[0].id : undefined),
      date: today(),
      testIds: [],
    },
  });

  async function onSubmit(values: SessionCreateInput) {
    setFailure(null);
    try {
      onDone(await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-3">
        <Field id="session-squad" label="Squad" error={errors.squadId?.message && "Choose the squad."}>
          <select
            id="session-squad"
            className="field"
            {...register("squadId", { setValueAs: (v) => (v === "" ? undefined : Number(v)) })}
          >
            <option value="">Choose…</option>
            {squads.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </Field>
        <Field id="session-date" label="Date" error={errors.date?.message}>
          <input id="session-date" type="date" className="field" {...register("date")} />
        </Field>
        <Field id="session-phase" label="Phase" error={errors.phase?.message}>
          <select id="session-phase" className="field" {...register("phase")}>
            <option value="">Choose…</option>
            {PHASES.map((p) => (
              <option key={p} value={p}>
                {PHASE_LABELS[p]}
              </option>
            ))}
          </select>
        </Field>
      </div>
      <fieldset>
        <legend className="label">Battery</legend>
        <Controller
          control={control}
          name="testIds"
          render={({ field }) => (
            <BatteryPicker
              tests={tests}
              chosen={field.value ?? []}
              onChange={field.onChange}
              onBlur={field.onBlur}
              empty={
                tests.length === 0 && (
                  <p className="text-sm text-ink-soft">
                    The Test library is empty. Ask your sport scientist to add tests.
                  </p>
                )
              }
            />
          )}
        />
        <FieldError message={errors.testIds?.message} />
      </fieldset>
      <Field id="session-notes" label="Notes (optional)" error={errors.notes?.message}>
        <textarea
          id="session-notes"
          rows={2}
          className="field"
          placeholder="Conditions, surface, warm-up…"
          {...register("notes")}
        />
      </Field>
      <SubmitRow failure={failure} submitting={isSubmitting} label="Create session" busyLabel="Creating…" />
    </form>
  );
}
