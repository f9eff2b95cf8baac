"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Dialog } from "@/components/dialog";
import { applyServerErrors, Field, SubmitRow } from "@/components/form-bits";
import { useCreateInvitation } from "@/hooks/use-writes";
import type { ClaimableAthlete } from "@/lib/client/queries";
import { ROLES } from "@/lib/domain";
import { ROLE_LABELS } from "@/lib/nav";
import { type InvitationCreateInput, invitationCreateSchema } from "@/lib/validation/people";

const ROLE_HINTS = {
  owner: "Everything, including people, deletion and mail.",
  scientist: "Every squad, the Test library, reliability, notes and publishing.",
  coach: "Only the squads you assign them to.",
  athlete: "Their own published results; links to an athlete record below.",
} as const;

export function InviteDialog({
  open,
  claimableAthletes,
  onClose,
  onSent,
}: {
  open: boolean;
  claimableAthletes: ClaimableAthlete[];
  onClose: () => void;
  onSent: (email: string) => void;
}) {
  return (
    <Dialog open={open} title="Invite someone" onClose={onClose}>
      {open && <InviteForm claimableAthletes={claimableAthletes} onSent={onSent} />}
    </Dialog>
  );
}

function InviteForm({
  claimableAthletes,
  onSent,
}: {
  claimableAthletes: ClaimableAthlete[];
  onSent: (email: string) => void;
}) {
  const [failure, setFailure] = useState<string | null>(null);
  const create = useCreateInvitation();
  const { register, handleSubmit, setError, watch, formState } = useForm<
    z.input<typeof invitationCreateSchema>,
    unknown,
    InvitationCreateInput
  >({
    resolver: zodResolver(invitationCreateSchema),
    defaultValues: { email: "", role: "coach", athleteId: null },
  });
  const role = watch("role");

  async function onSubmit(values: InvitationCreateInput) {
    setFailure(null);
    try {
      const invitation = await create.mutateAsync(values);
      onSent(invitation.email);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, ["email", "role", "athleteId"]));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit, () => setFailure(null))} noValidate className="space-y-4">
      <Field id="invite-email" label="E-mail" error={formState.errors.email?.message}>
        <input
          id="invite-email"
          type="email"
          autoComplete="off"
          className="field"
          aria-describedby={formState.errors.email ? "invite-email-error" : undefined}
          {...register("email")}
        />
      </Field>
      <fieldset className="space-y-1.5">
        <legend className="label">Role</legend>
        {ROLES.map((r) => (
          <label key={r} className="flex items-start gap-2 text-sm">
            <input type="radio" value={r} className="mt-1" {...register("role")} />
            <span>
              <span className="font-semibold">{ROLE_LABELS[r]}</span>
              <span className="block text-ink-soft">{ROLE_HINTS[r]}</span>
            </span>
          </label>
        ))}
        {formState.errors.role?.message && <p className="text-sm text-decline">{formState.errors.role.message}</p>}
      </fieldset>
      {role === "athlete" && (
        <Field id="invite-athlete" label="Athlete record" error={formState.errors.athleteId?.message}>
          {claimableAthletes.length === 0 ? (
            <p className="text-sm text-ink-soft">
              Every athlete already has an account or an invitation on its way. Add the athlete to a squad&apos;s Roster
              first.
            </p>
          ) : (
            <select
              id="invite-athlete"
              className="field"
              {...register("athleteId", { setValueAs: (v) => (v === "" || v === null ? null : Number(v)) })}
            >
              <option value="">Choose the athlete…</option>
              {claimableAthletes.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.name}
                  {a.externalId ? ` (${a.externalId})` : ""}
                </option>
              ))}
            </select>
          )}
        </Field>
      )}
      {role === "athlete" && (
        <p className="text-xs text-ink-soft">
          Invite an athlete only once their consent is recorded (and, for a minor, a parent&apos;s or guardian&apos;s).
        </p>
      )}
      <p className="text-sm text-ink-soft">
        They get a mail with a link that works once, for 7 days, to choose their password.
      </p>
      <SubmitRow
        failure={failure}
        submitting={formState.isSubmitting}
        label="Send the invitation"
        busyLabel="Sending…"
      />
    </form>
  );
}
