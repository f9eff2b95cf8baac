import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { SquadList } from "@/components/squads/squad-list";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";
import { canManageSquad } from "@/lib/auth/permissions";
import { squadQueries } from "@/lib/client/queries";
import { listSquads } from "@/lib/data/squads";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterIndexPage() {
  const actor = await pageGuard({ roles: STAFF });
  const client = serverQueryClient();
  await prefetch(client, squadQueries.list(), () => listSquads(actor));
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <SquadList role={actor.role} canCreate={canManageSquad(actor)} />
    </HydrationBoundary>
  );
}
