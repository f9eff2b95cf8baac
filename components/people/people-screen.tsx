"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { useState } from "react";
import { peopleQueries } from "@/lib/client/queries";
import { DeletionRequests } from "./deletion-requests";
import { InvitationList } from "./invitation-list";
import { InviteDialog } from "./invite-dialog";
import { MemberList } from "./member-list";

/** People (owner): who is in the organisation with which role, who is invited, who asked to be deleted. */
export function PeopleScreen() {
  const { data: members } = useSuspenseQuery(peopleQueries.members());
  const { data: invited } = useSuspenseQuery(peopleQueries.invitations());
  const { data: requests } = useSuspenseQuery(peopleQueries.deletionRequests());
  const [inviting, setInviting] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  return (
    <section aria-labelledby="people-heading" className="space-y-6">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <div>
          <h1 id="people-heading" className="text-2xl font-bold">
            People
          </h1>
          <p className="text-sm text-ink-soft">
            Members of your organisation and their roles, invitations on their way, and requests to delete an
            athlete&apos;s data.
          </p>
        </div>
        <button type="button" className="btn-primary" onClick={() => setInviting(true)}>
          Invite someone
        </button>
      </div>
      {notice && (
        <p role="status" className="rounded-md border border-line bg-band px-3 py-2 text-sm">
          {notice}
        </p>
      )}
      {requests.length > 0 && <DeletionRequests requests={requests} onNotice={setNotice} />}
      <MemberList members={members} onNotice={setNotice} />
      <InvitationList invitations={invited.invitations} onNotice={setNotice} />
      <p className="border-t border-line pt-4 text-xs leading-relaxed text-ink-soft">
        Athlete data is personal, often health-related data. Invite athletes only with their consent (for a minor, a
        parent&apos;s or guardian&apos;s too), under your organisation&apos;s data-protection rules. Deleting an athlete
        is real deletion: it cannot be undone.
      </p>
      <InviteDialog
        open={inviting}
        claimableAthletes={invited.claimableAthletes}
        onClose={() => setInviting(false)}
        onSent={(email) => {
          setInviting(false);
          setNotice(`An invitation is on its way to ${email}. The link works once, for 7 days.`);
        }}
      />
    </section>
  );
}
