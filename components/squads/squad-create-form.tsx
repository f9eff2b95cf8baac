"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, SubmitRow } from "@/components/form-bits";
import { useCreateSquad } from "@/hooks/use-writes";
import { type SquadCreateInput, squadCreateSchema } from "@/lib/validation/roster";

export function SquadCreateForm({ onDone }: { onDone: (squad: { id: number }) => void }) {
  const [failure, setFailure] = useState<string | null>(null);
  const create = useCreateSquad();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof squadCreateSchema>, unknown, SquadCreateInput>({
    resolver: zodResolver(squadCreateSchema),
  });

  async function onSubmit(values: SquadCreateInput) {
    setFailure(null);
    try {
      onDone(await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, ["name", "sport"]));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <Field id="squad-name" label="Squad name" error={errors.name?.message}>
        <input id="squad-name" className="field" placeholder="e.g. Academy U16" {...register("name")} />
      </Field>
      <Field id="squad-sport" label="Sport (optional)" error={errors.sport?.message}>
        <input id="squad-sport" className="field" {...register("sport")} />
      </Field>
      <SubmitRow failure={failure} submitting={isSubmitting} label="Create squad" busyLabel="Creating…" />
    </form>
  );
}
