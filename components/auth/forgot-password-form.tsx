"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { applyServerErrors, Field, FormAlert } from "@/components/form-bits";
import { passwordResetRequest } from "@/lib/client/writes";
import { type PasswordResetRequestInput, passwordResetRequestSchema } from "@/lib/validation/people";

export function ForgotPasswordForm() {
  const [sent, setSent] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<
    z.input<typeof passwordResetRequestSchema>,
    unknown,
    PasswordResetRequestInput
  >({ resolver: zodResolver(passwordResetRequestSchema), defaultValues: { email: "" } });

  async function onSubmit(values: PasswordResetRequestInput) {
    setFailure(null);
    try {
      setSent((await passwordResetRequest(values)).message);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, ["email"]));
    }
  }

  if (sent)
    return (
      <p role="status" className="rounded-md border border-line bg-band px-3 py-2 text-sm">
        {sent}
      </p>
    );
  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <Field id="email" label="E-mail" error={formState.errors.email?.message}>
        <input id="email" type="email" autoComplete="username" className="field" {...register("email")} />
      </Field>
      <FormAlert message={failure} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Sending…" : "Mail me a link"}
      </button>
    </form>
  );
}
