// Plain fetch, without React Query, so the sign-in page (which has no QueryClient) can use it too.

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
