import type { Metadata } from "next";
import { Suspense } from "react";
import { SignInForm } from "@/components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  return (
    <div className="card p-6 shadow-sm">
      <h1 className="mb-4 text-xl font-bold">Sign in</h1>
      <Suspense>
        <SignInForm />
      </Suspense>
      <p className="mt-6 border-t border-line pt-4 text-xs leading-relaxed text-ink-faint">
        Athlete data is personal, often health-related data. Use Changewise under your organisation&apos;s consent and
        data-protection rules.
      </p>
    </div>
  );
}
