import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { AthleteHistory } from "@/components/athletes/athlete-history";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard, pageId } from "@/lib/auth/page-guard";
import { athleteQueries } from "@/lib/client/queries";
import { getAthleteHistory } from "@/lib/data/athlete-history";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Athlete history" };

export default async function AthleteHistoryPage({ params }: { params: Promise<{ athleteId: string }> }) {
  const athleteId = pageId((await params).athleteId);
  // Athletes, and staff reaching outside their squads, get the same answer as an athlete who does not exist.
  const actor = await pageGuard({ roles: STAFF, athleteId });
  const client = serverQueryClient();
  await prefetch(client, athleteQueries.history(athleteId), () => getAthleteHistory(actor, athleteId));
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <AthleteHistory athleteId={athleteId} />
    </HydrationBoundary>
  );
}
