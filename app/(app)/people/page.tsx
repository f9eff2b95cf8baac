import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { PeopleScreen } from "@/components/people/people-screen";
import { pageGuard } from "@/lib/auth/page-guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { peopleQueries } from "@/lib/client/queries";
import { listDeletionRequests } from "@/lib/data/deletion-requests";
import { listClaimableAthletes, listInvitations } from "@/lib/data/invitations";
import { listMembers } from "@/lib/data/members";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const actor = await pageGuard({ roles: PEOPLE_ROLES });
  const client = serverQueryClient();
  await Promise.all([
    prefetch(client, peopleQueries.members(), () => listMembers(actor)),
    prefetch(client, peopleQueries.invitations(), async () => {
      const [invitations, claimableAthletes] = await Promise.all([
        listInvitations(actor),
        listClaimableAthletes(actor),
      ]);
      return { invitations, claimableAthletes };
    }),
    prefetch(client, peopleQueries.deletionRequests(), () => listDeletionRequests(actor)),
  ]);
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <PeopleScreen />
    </HydrationBoundary>
  );
}
