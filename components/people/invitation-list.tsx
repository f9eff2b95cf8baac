"use client";

import { useState } from "react";
import { type Column, TableCard } from "@/components/table-card";
import { useResendInvitation, useRevokeInvitation } from "@/hooks/use-writes";
import type { InvitationItem } from "@/lib/client/queries";
import { formatMoment } from "@/lib/labels";
import { ROLE_LABELS } from "@/lib/nav";

const COLUMNS: Column[] = [
  { label: "E-mail" },
  { label: "Role" },
  { label: "Invited by" },
  { label: "Link works until" },
  { label: "Actions", srOnly: true },
];

export function InvitationList({
  invitations,
  onNotice,
}: {
  invitations: InvitationItem[];
  onNotice: (message: string) => void;
}) {
  return (
    <section aria-labelledby="invitations-heading" className="space-y-2">
      <h2 id="invitations-heading" className="text-lg font-bold">
        Invitations ({invitations.length})
      </h2>
      {invitations.length === 0 ? (
        <p className="text-sm text-ink-soft">No invitation is waiting. Invite someone with the button above.</p>
      ) : (
        <TableCard columns={COLUMNS}>
          {invitations.map((invitation) => (
            <InvitationRow key={invitation.id} invitation={invitation} onNotice={onNotice} />
          ))}
        </TableCard>
      )}
    </section>
  );
}

function InvitationRow({ invitation, onNotice }: { invitation: InvitationItem; onNotice: (message: string) => void }) {
  const [confirmRevoke, setConfirmRevoke] = useState(false);
  const resend = useResendInvitation();
  const revoke = useRevokeInvitation();
  const busy = resend.isPending || revoke.isPending;
  const failed = (error: Error) => onNotice(`${invitation.email}: ${error.message}`);
  return (
    <tr className="border-b border-line last:border-0 align-top">
      <td className="px-3 py-2 font-semibold [overflow-wrap:anywhere]">{invitation.email}</td>
      <td className="px-3 py-2">
        {ROLE_LABELS[invitation.role]}
        {invitation.athleteName && <span className="block text-ink-soft">for {invitation.athleteName}</span>}
      </td>
      <td className="px-3 py-2">{invitation.invitedByName ?? "—"}</td>
      <td className="px-3 py-2 num">
        {invitation.expired ? (
          <span>
            <strong>Expired</strong> {formatMoment(invitation.expiresAt)}
          </span>
        ) : (
          formatMoment(invitation.expiresAt)
        )}
      </td>
      <td className="px-3 py-2">
        {confirmRevoke ? (
          <div className="flex flex-wrap justify-end gap-1.5">
            <span className="text-xs">Withdraw? The link stops working.</span>
            <button
              type="button"
              className="btn-quiet px-2 py-1 text-xs"
              disabled={busy}
              onClick={() =>
                revoke.mutate(invitation.id, {
                  onSuccess: () => onNotice(`The invitation to ${invitation.email} was withdrawn.`),
                  onError: failed,
                  onSettled: () => setConfirmRevoke(false),
                })
              }
            >
              Withdraw
            </button>
            <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setConfirmRevoke(false)}>
              Keep
            </button>
          </div>
        ) : (
          <div className="flex flex-wrap justify-end gap-1.5">
            <button
              type="button"
              className="btn-quiet px-2 py-1 text-xs"
              disabled={busy}
              aria-label={`Send again to ${invitation.email}`}
              onClick={() =>
                resend.mutate(invitation.id, {
                  onSuccess: () =>
                    onNotice(
                      `A new link is on its way to ${invitation.email}; the link in the earlier mail no longer works.`,
                    ),
                  onError: failed,
                })
              }
            >
              Send again
            </button>
            <button
              type="button"
              className="btn-quiet px-2 py-1 text-xs"
              disabled={busy}
              aria-label={`Withdraw the invitation to ${invitation.email}`}
              onClick={() => setConfirmRevoke(true)}
            >
              Withdraw
            </button>
          </div>
        )}
      </td>
    </tr>
  );
}
