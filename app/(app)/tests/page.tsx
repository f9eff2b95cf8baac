import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { TestLibrary } from "@/components/tests/test-library";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";
import { canEditTestLibrary } from "@/lib/auth/permissions";
import { testQueries } from "@/lib/client/queries";
import { listTests } from "@/lib/data/tests";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";

export const metadata: Metadata = { title: "Test library" };

export default async function TestLibraryPage() {
  const actor = await pageGuard({ roles: STAFF });
  const client = serverQueryClient();
  await prefetch(client, testQueries.list(), () => listTests(actor));
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <TestLibrary canEdit={canEditTestLibrary(actor)} />
    </HydrationBoundary>
  );
}
