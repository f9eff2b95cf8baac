import type { Metadata } from "next";
import Link from "next/link";
import { ResetPasswordForm } from "@/components/auth/reset-password-form";
import { RESET_MINUTES, resetLinkState } from "@/lib/data/password-reset";
import { tokenSchema } from "@/lib/validation/people";

export const metadata: Metadata = { title: "Choose a new password", referrer: "no-referrer" };

/** Public: the link in the reset mail. The token is the only key, so no guard. */
export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const parsed = tokenSchema.safeParse(token);
  const state = parsed.success ? await resetLinkState(parsed.data) : "spent";
  return (
    <div className="card p-6 shadow-sm">
      {state === "open" ? (
        <>
          <h1 className="mb-1 text-xl font-bold">Choose a new password</h1>
          <p className="mb-4 text-sm text-ink-soft">
            Saving it signs you in here and ends every other sign-in of your account.
          </p>
          <ResetPasswordForm token={token} />
        </>
      ) : (
        <>
          <h1 className="mb-2 text-xl font-bold">
            {state === "expired" ? "This reset link has expired" : "This reset link does not work"}
          </h1>
          <p className="text-sm">
            {state === "expired"
              ? `Reset links work for ${RESET_MINUTES} minutes. Ask for a new one.`
              : "It was used already or replaced by a newer mail. Ask for a new link."}
          </p>
          <p className="mt-4 text-sm">
            <Link href="/forgot-password" className="font-semibold underline underline-offset-2">
              Ask for a new link
            </Link>
          </p>
        </>
      )}
    </div>
  );
}
