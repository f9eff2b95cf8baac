"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { applyServerErrors, Field, FormAlert } from "@/components/form-bits";
import { acceptInvitationRequest } from "@/lib/client/writes";
import { invitationAcceptFields } from "@/lib/validation/people";

const SAME = "The two passwords differ.";

/** The accept page's form: the same fields the server checks, plus typing the password twice. */
const formSchema = (existingAccount: boolean) =>
  invitationAcceptFields
    .extend({ repeat: z.string() })
    .refine((v) => existingAccount || v.name, { path: ["name"], message: "Enter your name." })
    .refine((v) => existingAccount || v.password === v.repeat, { path: ["repeat"], message: SAME });

type FormInput = z.input<ReturnType<typeof formSchema>>;
type FormOutput = z.output<ReturnType<typeof formSchema>>;

export function AcceptInvitationForm({
  token,
  email,
  existingAccount,
}: {
  token: string;
  email: string;
  existingAccount: boolean;
}) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(formSchema(existingAccount)),
    defaultValues: existingAccount ? { password: "", repeat: "" } : { name: "", password: "", repeat: "" },
  });
  const { errors } = formState;

  async function onSubmit({ name, password }: FormOutput) {
    setFailure(null);
    try {
      await acceptInvitationRequest({ token, password, ...(existingAccount ? {} : { name }) });
    } catch (error) {
      setFailure(applyServerErrors(error, setError, ["name", "password"]));
      return;
    }
    const result = await signIn("credentials", { email, password, redirect: false });
    if (!result || result.error) {
      // The account exists now; only the automatic sign-in failed.
      router.replace("/sign-in");
      return;
    }
    router.replace("/");
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      {!existingAccount && (
        <Field id="name" label="Your name" error={errors.name?.message}>
          <input id="name" autoComplete="name" className="field" {...register("name")} />
        </Field>
      )}
      <Field
        id="password"
        label={existingAccount ? "Your current Changewise password" : "Choose a password"}
        error={errors.password?.message}
      >
        <input
          id="password"
          type="password"
          autoComplete={existingAccount ? "current-password" : "new-password"}
          aria-describedby="password-hint"
          className="field"
          {...register("password")}
        />
      </Field>
      <p id="password-hint" className="-mt-2 text-xs text-ink-soft">
        {existingAccount
          ? "This address already signs in to Changewise elsewhere; joining adds this organisation to that account."
          : "At least 10 characters. A phrase of a few words is easy to remember and hard to guess."}
      </p>
      {!existingAccount && (
        <Field id="repeat" label="Type it again" error={errors.repeat?.message}>
          <input id="repeat" type="password" autoComplete="new-password" className="field" {...register("repeat")} />
        </Field>
      )}
      <FormAlert message={failure} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Joining…" : "Join and sign in"}
      </button>
    </form>
  );
}
