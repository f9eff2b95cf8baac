import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SavedReport } from "@/components/report/saved-report";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard, pageId } from "@/lib/auth/page-guard";
import { reportQueries } from "@/lib/client/queries";
import { getSavedReport } from "@/lib/data/reports";
import { ApiError } from "@/lib/errors";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Saved report" };

export default async function SavedReportPage({ params }: { params: Promise<{ reportId: string }> }) {
  const reportId = pageId((await params).reportId);
  const actor = await pageGuard({ roles: STAFF });
  const client = serverQueryClient();
  try {
    await prefetch(client, reportQueries.savedOne(reportId), () => getSavedReport(actor, reportId));
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) notFound();
    throw error;
  }
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <SavedReport reportId={reportId} />
    </HydrationBoundary>
  );
}
