import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { SessionSheet } from "@/components/sheet/session-sheet";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard, pageId } from "@/lib/auth/page-guard";
import { sessionQueries } from "@/lib/client/queries";
import { listSessionAudit } from "@/lib/data/audit";
import { getSessionSheet } from "@/lib/data/sessions";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Session sheet" };

export default async function SessionSheetPage({ params }: { params: Promise<{ sessionId: string }> }) {
  const sessionId = pageId((await params).sessionId);
  const actor = await pageGuard({ roles: STAFF, sessionId });
  const client = serverQueryClient();
  await Promise.all([
    prefetch(client, sessionQueries.sheet(sessionId), () => getSessionSheet(actor, sessionId)),
    prefetch(client, sessionQueries.audit(sessionId), () => listSessionAudit(actor, sessionId)),
  ]);
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <SessionSheet sessionId={sessionId} />
    </HydrationBoundary>
  );
}
