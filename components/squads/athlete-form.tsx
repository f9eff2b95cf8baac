"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FieldError, FormAlert, applyServerErrors } from "@/components/form-bits";
import type { RosterAthlete } from "@/hooks/api-types";
import { fetchJson } from "@/hooks/use-api";
import { athleteCreateSchema, type AthleteCreateInput } from "@/lib/validation/roster";

const FIELDS = ["name", "position", "sex", "dateOfBirth", "externalId", "notes"] as const;
const emptyToNull = (v: unknown) => (v === "" || v === undefined ? null : v);

/** New athlete for a squad (POST), or changes to an existing one (PATCH). */
export function AthleteForm({
  squadId,
  athlete,
  onDone,
}: {
  squadId: number;
  athlete: RosterAthlete | null;
  onDone: (saved: RosterAthlete) => void;
}) {
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof athleteCreateSchema>, unknown, AthleteCreateInput>({
    resolver: zodResolver(athleteCreateSchema),
    defaultValues: athlete
      ? {
          name: athlete.name,
          position: athlete.position ?? "",
          sex: athlete.sex,
          dateOfBirth: athlete.dateOfBirth ?? "",
          externalId: athlete.externalId ?? "",
          notes: athlete.notes ?? "",
        }
      : { sex: null },
  });

  async function onSubmit(values: AthleteCreateInput) {
    setFailure(null);
    try {
      const saved = athlete
        ? await fetchJson<{ athlete: RosterAthlete }>(`/api/athletes/${athlete.id}`, { method: "PATCH", body: JSON.stringify(values) })
        : await fetchJson<{ athlete: RosterAthlete }>(`/api/squads/${squadId}/athletes`, { method: "POST", body: JSON.stringify(values) });
      onDone(saved.athlete);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  }

  const id = (name: string) => `athlete-${athlete?.id ?? "new"}-${name}`;
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="sm:col-span-2">
          <label htmlFor={id("name")} className="label">Name</label>
          <input id={id("name")} className="field" autoComplete="off" {...register("name")} />
          <FieldError message={errors.name?.message} />
        </div>
        <div>
          <label htmlFor={id("position")} className="label">Position or event</label>
          <input id={id("position")} className="field" placeholder="e.g. MF, 400 m" {...register("position")} />
          <FieldError message={errors.position?.message} />
        </div>
        <div>
          <label htmlFor={id("sex")} className="label">Sex</label>
          <select id={id("sex")} className="field" {...register("sex", { setValueAs: emptyToNull })}>
            <option value="">Not recorded</option>
            <option value="female">Female</option>
            <option value="male">Male</option>
            <option value="other">Other</option>
          </select>
          <FieldError message={errors.sex?.message} />
        </div>
        <div>
          <label htmlFor={id("dateOfBirth")} className="label">Date of birth</label>
          <input id={id("dateOfBirth")} type="date" className="field" {...register("dateOfBirth")} />
          <FieldError message={errors.dateOfBirth?.message} />
        </div>
        <div>
          <label htmlFor={id("externalId")} className="label">External id</label>
          <input id={id("externalId")} className="field" placeholder="id in the gates or force plate" {...register("externalId")} />
          <FieldError message={errors.externalId?.message} />
        </div>
        <div className="sm:col-span-2">
          <label htmlFor={id("notes")} className="label">Notes</label>
          <textarea id={id("notes")} rows={2} className="field" {...register("notes")} />
          <FieldError message={errors.notes?.message} />
        </div>
      </div>
      <p className="text-xs text-ink-faint">
        Athlete data is personal data. Record only what the squad needs, with consent (a guardian&apos;s for minors).
      </p>
      <FormAlert message={failure} />
      <div className="flex justify-end">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : athlete ? "Save athlete" : "Add athlete"}
        </button>
      </div>
    </form>
  );
}
