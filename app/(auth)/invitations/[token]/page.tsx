import type { Metadata } from "next";
import Link from "next/link";
import { AcceptInvitationForm } from "@/components/auth/accept-invitation-form";
import { previewInvitation } from "@/lib/data/invitations";
import { ROLE_LABELS } from "@/lib/nav";
import { tokenSchema } from "@/lib/validation/people";

export const metadata: Metadata = { title: "Accept the invitation", referrer: "no-referrer" };

/** Public: the link in the invitation mail. The token is the only key, so no guard. */
export default async function AcceptInvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const parsed = tokenSchema.safeParse(token);
  const invitation = parsed.success ? await previewInvitation(parsed.data) : ({ state: "spent" } as const);
  return (
    <div className="card p-6 shadow-sm">
      {invitation.state === "open" ? (
        <>
          <h1 className="mb-1 text-xl font-bold">Join {invitation.organizationName}</h1>
          <p className="mb-4 text-sm text-ink-soft">
            You are invited as {ROLE_LABELS[invitation.role].toLowerCase()}
            {invitation.athleteName ? ` (athlete record: ${invitation.athleteName})` : ""}, with the address{" "}
            <span className="font-semibold text-ink">{invitation.email}</span>.
          </p>
          <AcceptInvitationForm token={token} email={invitation.email} existingAccount={invitation.existingAccount} />
          <p className="mt-6 border-t border-line pt-4 text-xs leading-relaxed text-ink-soft">
            {invitation.role === "athlete"
              ? "Your results are personal data. You can see your own published results, export them, and ask for them to be deleted."
              : "Athlete data is personal, often health-related data. Use Changewise under your organisation's consent and data-protection rules."}
          </p>
        </>
      ) : (
        <>
          <h1 className="mb-2 text-xl font-bold">
            {invitation.state === "expired" ? "This invitation has expired" : "This link does not work any more"}
          </h1>
          <p className="text-sm">
            {invitation.state === "expired"
              ? `Invitations work for 7 days. Ask the person at ${invitation.organizationName} who invited you to send it again.`
              : "It was used already, withdrawn, or replaced by a newer mail. Open the newest invitation mail, or ask for a new one."}
          </p>
          <p className="mt-4 text-sm">
            Already have an account?{" "}
            <Link href="/sign-in" className="font-semibold underline underline-offset-2">
              Sign in
            </Link>
          </p>
        </>
      )}
    </div>
  );
}
