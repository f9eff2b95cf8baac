import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password?" };

export default function ForgotPasswordPage() {
  return (
    <div className="card p-6 shadow-sm">
      <h1 className="mb-1 text-xl font-bold">Forgot your password?</h1>
      <p className="mb-4 text-sm text-ink-soft">
        Enter the address you sign in with. If it belongs to an account, we mail a link to choose a new password.
      </p>
      <ForgotPasswordForm />
      <p className="mt-6 border-t border-line pt-4 text-sm">
        <Link href="/sign-in" className="font-semibold underline underline-offset-2">
          Back to sign-in
        </Link>
      </p>
    </div>
  );
}
