import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { AthleteHome } from "@/components/athlete-home";
import { SquadsOverview } from "@/components/squads-overview";
import { guard } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";
import { canManageSquad, isAthlete } from "@/lib/auth/permissions";
import { athleteQueries, squadQueries } from "@/lib/client/queries";
import { getMyProgress } from "@/lib/data/my-progress";
import { listSquads } from "@/lib/data/squads";
import { getWorkToDo } from "@/lib/data/work-to-do";
import { ApiError } from "@/lib/errors";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

/** The tab names the screen: Squads for staff, My progress for an athlete. */
export async function generateMetadata(): Promise<Metadata> {
  const actor = await guard().catch((error) => {
    if (error instanceof ApiError) return null;
    throw error;
  });
  return { title: actor && isAthlete(actor) ? "My progress" : "Squads" };
}

export default async function HomePage() {
  const actor = await pageGuard();
  const client = serverQueryClient();
  if (isAthlete(actor)) {
    const { athleteId } = actor;
    if (athleteId) await prefetch(client, athleteQueries.myProgress(), () => getMyProgress(actor));
    return (
      <HydrationBoundary state={dehydrate(client)}>
        <AthleteHome linked={athleteId !== null} name={actor.name} />
      </HydrationBoundary>
    );
  }
  await Promise.all([
    prefetch(client, squadQueries.list(), () => listSquads(actor)),
    prefetch(client, squadQueries.workToDo(), () => getWorkToDo(actor)),
  ]);
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <SquadsOverview role={actor.role} canCreate={canManageSquad(actor)} />
    </HydrationBoundary>
  );
}
