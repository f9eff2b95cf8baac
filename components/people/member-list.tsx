"use client";

import Link from "next/link";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import { type Column, TableCard } from "@/components/table-card";
import { useRemoveMember, useUpdateMember } from "@/hooks/use-writes";
import type { MemberItem } from "@/lib/client/queries";
import { ROLES, type Role } from "@/lib/domain";
import { formatMoment } from "@/lib/labels";
import { ROLE_LABELS } from "@/lib/nav";

const COLUMNS: Column[] = [
  // Wide enough that an address breaks only when it must, on a tablet too.
  { label: "Name and e-mail", className: "min-w-[13rem]" },
  { label: "Role" },
  { label: "Squads or record" },
  { label: "Member since" },
  { label: "Actions", srOnly: true },
];

const STAFF_ROLES = ROLES.filter((r) => r !== "athlete");

export function MemberList({ members, onNotice }: { members: MemberItem[]; onNotice: (message: string) => void }) {
  const [removing, setRemoving] = useState<MemberItem | null>(null);
  return (
    <section aria-labelledby="members-heading" className="space-y-2">
      <h2 id="members-heading" className="text-lg font-bold">
        Members ({members.length})
      </h2>
      <TableCard columns={COLUMNS}>
        {members.map((member) => (
          <tr key={member.userId} className="border-b border-line last:border-0 align-top">
            <td className="px-3 py-2 font-semibold">
              {member.name}
              {member.isYou && <span className="font-normal text-ink-soft"> (you)</span>}
              <span className="block font-normal text-ink-soft [overflow-wrap:anywhere]">{member.email}</span>
            </td>
            <td className="px-3 py-2">
              <RoleControl member={member} onNotice={onNotice} />
            </td>
            <td className="px-3 py-2">
              <Assignments member={member} />
            </td>
            <td className="px-3 py-2 whitespace-nowrap num">{formatMoment(member.joinedAt).slice(0, 10)}</td>
            <td className="px-3 py-2 text-right">
              <button
                type="button"
                className="btn-quiet px-2 py-1 text-xs"
                disabled={member.lastOwner}
                title={member.lastOwner ? "The only owner cannot be removed." : undefined}
                aria-label={`Remove ${member.name}`}
                onClick={() => setRemoving(member)}
              >
                Remove
              </button>
            </td>
          </tr>
        ))}
      </TableCard>
      <RemoveDialog member={removing} onClose={() => setRemoving(null)} onNotice={onNotice} />
    </section>
  );
}

function Assignments({ member }: { member: MemberItem }) {
  if (member.athlete) return <span>Athlete record: {member.athlete.name}</span>;
  if (member.role !== "coach") return <span className="text-ink-soft">Whole organisation</span>;
  if (member.squads.length === 0)
    return <span className="text-ink-soft">No squad yet — assign coaches in a squad&apos;s Roster settings.</span>;
  return (
    <ul className="space-y-0.5">
      {member.squads.map((squad) => (
        <li key={squad.id}>
          <Link href={`/squads/${squad.id}`} className="underline underline-offset-2">
            {squad.name}
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** Staff roles change here; an athlete's account stays an athlete's (it belongs to their record). */
function RoleControl({ member, onNotice }: { member: MemberItem; onNotice: (message: string) => void }) {
  const [role, setRole] = useState<Role>(member.role);
  const update = useUpdateMember();
  if (member.role === "athlete") return <span>{ROLE_LABELS.athlete}</span>;
  const id = `role-${member.userId}`;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={id} className="sr-only">
        Role of {member.name}
      </label>
      <select
        id={id}
        className="field w-auto py-1 text-sm"
        value={role}
        disabled={member.lastOwner || update.isPending}
        title={member.lastOwner ? "The only owner keeps the role. Make someone else an owner first." : undefined}
        onChange={(e) => setRole(e.target.value as Role)}
      >
        {STAFF_ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </select>
      {member.lastOwner && <span className="w-full text-xs text-ink-soft">The only owner keeps this role.</span>}
      {role !== member.role && (
        <button
          type="button"
          className="btn-quiet px-2 py-1 text-xs"
          disabled={update.isPending}
          onClick={() =>
            update.mutate(
              { userId: member.userId, input: { role } },
              {
                onSuccess: (saved) => onNotice(`${saved.name} is now ${ROLE_LABELS[saved.role].toLowerCase()}.`),
                onError: (error) => {
                  setRole(member.role);
                  onNotice(`${member.name}: ${error.message}`);
                },
              },
            )
          }
        >
          Save role
        </button>
      )}
    </div>
  );
}

function RemoveDialog({
  member,
  onClose,
  onNotice,
}: {
  member: MemberItem | null;
  onClose: () => void;
  onNotice: (message: string) => void;
}) {
  const remove = useRemoveMember();
  return (
    <Dialog open={member !== null} title={member ? `Remove ${member.name}?` : "Remove"} onClose={onClose}>
      {member && (
        <div className="space-y-3 text-sm">
          <p>
            {member.name} loses access to your organisation at once: every session they have open ends.
            {member.role === "coach" && " They are taken off the squads they coach."}
            {member.athlete &&
              ` Their athlete record (${member.athlete.name}) and its results stay; to delete those, use a deletion request or delete the athlete.`}
          </p>
          {member.isYou && <p className="font-semibold">This is your own account: you will be signed out.</p>}
          <FormAlert message={remove.error ? remove.error.message : null} />
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet" onClick={onClose}>
              Cancel
            </button>
            <button
              type="button"
              className="btn-primary"
              disabled={remove.isPending}
              onClick={() =>
                remove.mutate(member.userId, {
                  onSuccess: () => {
                    onNotice(`${member.name} was removed.`);
                    onClose();
                    if (member.isYou) window.location.assign("/sign-in");
                  },
                })
              }
            >
              {remove.isPending ? "Removing…" : `Remove ${member.name}`}
            </button>
          </div>
        </div>
      )}
    </Dialog>
  );
}
