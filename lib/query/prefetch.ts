import "server-only";
import { type DataTag, QueryClient, type QueryKey } from "@tanstack/react-query";

/**
 * Server side of the one data-fetching pattern: a page reads its data straight from lib/data
 * under the same keys the client queries use, and hands it over with `HydrationBoundary`, so
 * the screen renders with data at once — the segment's `loading.tsx` is the only loading state.
 */
export function serverQueryClient() {
  // Matches the browser's staleTime, so hydrated data is not refetched the moment it arrives.
  return new QueryClient({ defaultOptions: { queries: { staleTime: 30_000 } } });
}

type Tagged<T> = { queryKey: DataTag<QueryKey, T, unknown> };

/**
 * Loads one query on the server. The key's data tag makes `load` return exactly what the
 * client's fetch would, so the two cannot drift apart. A failed load is not swallowed: the
 * segment's error boundary shows it, as it would a failed client read.
 */
export async function prefetch<T>(client: QueryClient, options: Tagged<T>, load: () => Promise<T>) {
  client.setQueryData(options.queryKey, await load());
}
