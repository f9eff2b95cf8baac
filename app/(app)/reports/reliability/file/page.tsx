import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { ReliabilityFromFile } from "@/components/reliability/reliability-from-file";
import { pageGuard } from "@/lib/auth/page-guard";
import { canRunReliability, RELIABILITY_ROLES } from "@/lib/auth/permissions";
import { testQueries } from "@/lib/client/queries";
import { listTests } from "@/lib/data/tests";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Reliability check of a file" };

export default async function ReliabilityFilePage() {
  const actor = await pageGuard({ roles: RELIABILITY_ROLES });
  const client = serverQueryClient();
  await prefetch(client, testQueries.list(), () => listTests(actor));
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <ReliabilityFromFile canAdopt={canRunReliability(actor)} />
    </HydrationBoundary>
  );
}
