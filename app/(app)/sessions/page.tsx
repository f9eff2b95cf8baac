import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { SessionList } from "@/components/sessions/session-list";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";
import { canPublish } from "@/lib/auth/permissions";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { listSessions } from "@/lib/data/sessions";
import { listSquads } from "@/lib/data/squads";
import { listTests } from "@/lib/data/tests";
import { canonicalId } from "@/lib/ids";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Sessions" };

export default async function SessionsPage({
  searchParams,
}: {
  searchParams: Promise<{ squadId?: string | string[] }>;
}) {
  const actor = await pageGuard({ roles: STAFF });
  const raw = (await searchParams).squadId;
  // A malformed filter shows every session rather than an error page.
  const squadId = canonicalId(Array.isArray(raw) ? raw[0] : raw);
  const client = serverQueryClient();
  await Promise.all([
    prefetch(client, squadQueries.list(), () => listSquads(actor)),
    prefetch(client, testQueries.list({ archived: true }), () => listTests(actor, { includeArchived: true })),
    prefetch(client, sessionQueries.list({ squadId }), () => listSessions(actor, { squadId: squadId ?? undefined })),
  ]);
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <SessionList canPublish={canPublish(actor)} initialSquadId={squadId} />
    </HydrationBoundary>
  );
}
