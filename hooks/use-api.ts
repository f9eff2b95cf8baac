"use client";

import { useQuery, type UseQueryOptions } from "@tanstack/react-query";

export class ApiClientError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly body: unknown,
  ) {
    super(message);
  }
}

/** Fetches our JSON API and turns the error shape into a thrown ApiClientError. */
export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, {
    ...init,
    headers: { Accept: "application/json", ...(init?.body && typeof init.body === "string" ? { "Content-Type": "application/json" } : {}), ...init?.headers },
  });
  const body = await response.json().catch(() => null);
  if (!response.ok) {
    const error = (body as { error?: { code?: string; message?: string } } | null)?.error;
    throw new ApiClientError(response.status, error?.code ?? "unknown", error?.message ?? `Request failed (${response.status}).`, body);
  }
  return body as T;
}

export function useApi<T>(url: string | null, options?: Omit<UseQueryOptions<T>, "queryKey" | "queryFn">) {
  return useQuery<T>({
    queryKey: [url],
    queryFn: () => fetchJson<T>(url as string),
    enabled: url !== null,
    ...options,
  });
}
