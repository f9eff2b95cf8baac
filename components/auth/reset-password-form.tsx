"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { applyServerErrors, Field, FormAlert } from "@/components/form-bits";
import { passwordResetConfirmRequest } from "@/lib/client/writes";
import { passwordResetFields } from "@/lib/validation/people";

const formSchema = passwordResetFields
  .extend({ repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ["repeat"], message: "The two passwords differ." });
type FormInput = z.input<typeof formSchema>;
type FormOutput = z.output<typeof formSchema>;

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(formSchema),
    defaultValues: { password: "", repeat: "" },
  });
  const { errors } = formState;

  async function onSubmit({ password }: FormOutput) {
    setFailure(null);
    let email: string;
    try {
      ({ email } = await passwordResetConfirmRequest({ token, password }));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, ["password"]));
      return;
    }
    const result = await signIn("credentials", { email, password, redirect: false });
    router.replace(!result || result.error ? "/sign-in" : "/");
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <Field id="password" label="New password" error={errors.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="new-password"
          aria-describedby="password-hint"
          className="field"
          {...register("password")}
        />
      </Field>
      <p id="password-hint" className="-mt-2 text-xs text-ink-soft">
        At least 10 characters. A phrase of a few words is easy to remember and hard to guess.
      </p>
      <Field id="repeat" label="Type it again" error={errors.repeat?.message}>
        <input id="repeat" type="password" autoComplete="new-password" className="field" {...register("repeat")} />
      </Field>
      <FormAlert message={failure} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Saving…" : "Save and sign in"}
      </button>
    </form>
  );
}
