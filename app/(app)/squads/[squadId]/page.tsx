import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { Roster } from "@/components/squads/roster";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard, pageId } from "@/lib/auth/page-guard";
import { squadQueries } from "@/lib/client/queries";
import { listSquadAthletes } from "@/lib/data/athletes";
import { getSquad } from "@/lib/data/squads";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage({ params }: { params: Promise<{ squadId: string }> }) {
  const squadId = pageId((await params).squadId);
  // A coach reaching for another coach's squad gets the same answer as a squad that does not exist.
  const actor = await pageGuard({ roles: STAFF, squadId });
  const client = serverQueryClient();
  await Promise.all([
    prefetch(client, squadQueries.detail(squadId), () => getSquad(actor, squadId)),
    prefetch(client, squadQueries.roster(squadId), () => listSquadAthletes(actor, squadId)),
  ]);
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <Roster squadId={squadId} />
    </HydrationBoundary>
  );
}
