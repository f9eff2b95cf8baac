"use client";

import { useQuery, type UseQueryOptions } from "@tanstack/react-query";
import { fetchJson } from "@/lib/client/fetch-json";

export { ApiClientError, fetchJson } from "@/lib/client/fetch-json";

export function useApi<T>(url: string | null, options?: Omit<UseQueryOptions<T>, "queryKey" | "queryFn">) {
  return useQuery<T>({
    queryKey: [url],
    queryFn: () => fetchJson<T>(url as string),
    enabled: url !== null,
    ...options,
  });
}
