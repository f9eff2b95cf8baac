"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/form-bits";
import { safeNextPath } from "@/lib/safe-next";
import { type SignInInput, signInSchema } from "@/lib/validation/auth";

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  async function onSubmit(values: SignInInput) {
    setFailure(null);
    const result = await signIn("credentials", { ...values, redirect: false });
    if (!result || result.error) {
      setFailure(
        !result || result.error === "CredentialsSignin"
          ? "That e-mail and password do not match an account."
          : result.error,
      );
      return;
    }
    router.replace(safeNextPath(params.get("next"), window.location.origin));
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input id="email" type="email" autoComplete="username" className="field" {...register("email")} />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          className="field"
          {...register("password")}
        />
      </Field>
      <FormAlert message={failure} />
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </button>
      <p className="text-center text-sm">
        <Link href="/forgot-password" className="underline underline-offset-2">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
