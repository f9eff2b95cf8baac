"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, SubmitRow } from "@/components/form-bits";
import { useAddAthlete, useUpdateAthlete } from "@/hooks/use-writes";
import type { RosterAthlete } from "@/lib/client/queries";
import { type AthleteCreateInput, athleteCreateSchema } from "@/lib/validation/roster";

const FIELDS = [
  "name",
  "position",
  "sex",
  "dateOfBirth",
  "externalId",
  "notes",
  "consentRecordedOn",
  "guardianConsentOn",
  "aliases",
] as const;
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
  const add = useAddAthlete(squadId);
  const update = useUpdateAthlete();
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
          consentRecordedOn: athlete.consentRecordedOn ?? "",
          guardianConsentOn: athlete.guardianConsentOn ?? "",
          aliases: athlete.aliases.join(", "),
        }
      : { sex: null },
  });

  async function onSubmit(values: AthleteCreateInput) {
    setFailure(null);
    try {
      onDone(
        athlete ? await update.mutateAsync({ athleteId: athlete.id, input: values }) : await add.mutateAsync(values),
      );
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  }

  const id = (name: string) => `athlete-${athlete?.id ?? "new"}-${name}`;
  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id={id("name")} label="Name" error={errors.name?.message} className="sm:col-span-2">
          <input id={id("name")} className="field" autoComplete="off" {...register("name")} />
        </Field>
        <Field id={id("position")} label="Position or event" error={errors.position?.message}>
          <input id={id("position")} className="field" placeholder="e.g. MF, 400 m" {...register("position")} />
        </Field>
        <Field id={id("sex")} label="Sex" error={errors.sex?.message}>
          <select id={id("sex")} className="field" {...register("sex", { setValueAs: emptyToNull })}>
            <option value="">Not recorded</option>
            <option value="female">Female</option>
            <option value="male">Male</option>
            <option value="other">Other</option>
          </select>
        </Field>
        <Field id={id("dateOfBirth")} label="Date of birth" error={errors.dateOfBirth?.message}>
          <input id={id("dateOfBirth")} type="date" className="field" {...register("dateOfBirth")} />
        </Field>
        <Field id={id("externalId")} label="External id" error={errors.externalId?.message}>
          <input
            id={id("externalId")}
            className="field"
            placeholder="id in the gates or force plate"
            {...register("externalId")}
          />
        </Field>
        <Field
          id={id("aliases")}
          label="Other spellings in files (optional)"
          error={errors.aliases?.message}
          className="sm:col-span-2"
        >
          <input
            id={id("aliases")}
            className="field"
            placeholder="e.g. L. Dempsey, Dempsey Luca"
            aria-describedby={`${id("aliases")}-help${errors.aliases ? ` ${id("aliases")}-error` : ""}`}
            aria-invalid={errors.aliases ? true : undefined}
            {...register("aliases")}
          />
          <p id={`${id("aliases")}-help`} className="mt-1 text-xs text-ink-soft">
            Separate them with commas. The Import reads these as this athlete; it also remembers the ones you match
            there.
          </p>
        </Field>
        <Field id={id("notes")} label="Notes" error={errors.notes?.message} className="sm:col-span-2">
          <textarea id={id("notes")} rows={2} className="field" {...register("notes")} />
        </Field>
      </div>
      <fieldset className="space-y-2 rounded-md border border-line p-3">
        <legend className="px-1 text-sm font-semibold">Consent to see their results</legend>
        <p className="text-xs text-ink-soft">
          Until the athlete&apos;s consent is recorded — and, while they are under 18, a parent&apos;s or
          guardian&apos;s too — they do not see their results on My progress and get no results mail.
        </p>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field
            id={id("consentRecordedOn")}
            label="Athlete's consent recorded on"
            error={errors.consentRecordedOn?.message}
          >
            <input id={id("consentRecordedOn")} type="date" className="field" {...register("consentRecordedOn")} />
          </Field>
          <Field
            id={id("guardianConsentOn")}
            label="Guardian's consent recorded on (under 18)"
            error={errors.guardianConsentOn?.message}
          >
            <input id={id("guardianConsentOn")} type="date" className="field" {...register("guardianConsentOn")} />
          </Field>
        </div>
      </fieldset>
      <p className="text-xs text-ink-faint">
        Athlete data is personal data. Record only what the squad needs, with consent (a guardian&apos;s for minors).
      </p>
      <SubmitRow
        failure={failure}
        submitting={isSubmitting}
        label={athlete ? "Save athlete" : "Add athlete"}
        busyLabel="Saving…"
      />
    </form>
  );
}
