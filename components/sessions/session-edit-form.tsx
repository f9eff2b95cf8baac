"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, FieldError, SubmitRow } from "@/components/form-bits";
import { useUpdateSession } from "@/hooks/use-writes";
import { type SheetData, testQueries } from "@/lib/client/queries";
import { PHASES } from "@/lib/domain";
import { PHASE_LABELS } from "@/lib/labels";
import { type SessionUpdateInput, sessionUpdateSchema } from "@/lib/validation/sessions";
import { BatteryPicker } from "./battery-picker";

const FIELDS = ["date", "phase", "testIds", "notes"] as const;

/**
 * Corrects a session's date, phase, notes and battery. A test that already has scores in
 * this session stays in the battery, so no score is ever orphaned.
 */
export function SessionEditForm({ data, onDone }: { data: SheetData; onDone: () => void }) {
  const library = useQuery(testQueries.list());
  const update = useUpdateSession();
  const { session } = data;
  const scored = new Set(data.results.map((r) => r.testId));
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof sessionUpdateSchema>, unknown, SessionUpdateInput>({
    resolver: zodResolver(sessionUpdateSchema),
    defaultValues: {
      version: session.version,
      date: session.date,
      phase: session.phase,
      notes: session.notes ?? "",
      testIds: data.tests.map((t) => t.id),
    },
  });

  // Archived tests cannot join a battery, but one already in it stays listed.
  const choices = [...data.tests, ...(library.data ?? []).filter((t) => !data.tests.some((b) => b.id === t.id))];

  async function onSubmit(values: SessionUpdateInput) {
    setFailure(null);
    try {
      await update.mutateAsync({ sessionId: session.id, input: values });
      onDone();
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="edit-session-date" label="Date" error={errors.date?.message}>
          <input id="edit-session-date" type="date" className="field" {...register("date")} />
        </Field>
        <Field id="edit-session-phase" label="Phase" error={errors.phase?.message}>
          <select id="edit-session-phase" className="field" {...register("phase")}>
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
              tests={choices}
              chosen={field.value ?? []}
              onChange={field.onChange}
              onBlur={field.onBlur}
              locked={scored}
              empty={
                library.isPending && (
                  <p role="status" className="text-sm text-ink-soft">
                    Loading the Test library…
                  </p>
                )
              }
            />
          )}
        />
        <FieldError message={errors.testIds?.message} />
      </fieldset>
      <Field id="edit-session-notes" label="Notes (optional)" error={errors.notes?.message}>
        <textarea id="edit-session-notes" rows={2} className="field" {...register("notes")} />
      </Field>
      <SubmitRow failure={failure} submitting={isSubmitting} label="Save session" busyLabel="Saving…" />
    </form>
  );
}
