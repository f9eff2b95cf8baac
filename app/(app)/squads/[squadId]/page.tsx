import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { Roster } from "@/components/squads/roster";
import { guard, STAFF } from "@/lib/auth/guard";
import { pageGuard, pageId } from "@/lib/auth/page-guard";
import { squadQueries } from "@/lib/client/queries";
import { listSquadAthletes } from "@/lib/data/athletes";
import { getSquad } from "@/lib/data/squads";
import { ApiError } from "@/lib/errors";
import { canonicalId } from "@/lib/ids";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

type Props = { params: Promise<{ squadId: string }> };

/**
 * "Roster · <squad>" in the tab. A squad outside the caller's reach gets the plain title, the
 * same for one that does not exist; the page itself answers with the not-found screen.
 */
export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const squadId = canonicalId((await params).squadId);
  if (squadId === null) return { title: "Roster" };
  try {
    const actor = await guard({ roles: STAFF, squadId });
    const { squad } = await getSquad(actor, squadId);
    return { title: `Roster · ${squad.name}` };
  } catch (error) {
    if (error instanceof ApiError) return { title: "Roster" };
    throw error;
  }
}

export default async function RosterPage({ params }: Props) {
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
