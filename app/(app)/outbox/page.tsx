import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { OutboxScreen } from "@/components/outbox/outbox-screen";
import { pageGuard } from "@/lib/auth/page-guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { outboxQueries } from "@/lib/client/queries";
import { getOutbox } from "@/lib/data/outbox";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Outbox" };

export default async function OutboxPage() {
  const actor = await pageGuard({ roles: PEOPLE_ROLES });
  const client = serverQueryClient();
  await prefetch(client, outboxQueries.list(), () => getOutbox(actor));
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <OutboxScreen />
    </HydrationBoundary>
  );
}
