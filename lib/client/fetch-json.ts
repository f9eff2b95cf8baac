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

/** The error an API answer carries (`{ error: { code, message } }`), or a plain one when the body has none. */
export function apiErrorFrom(status: number, body: unknown, fallback = `Request failed (${status}).`): ApiClientError {
  const error = (body as { error?: { code?: string; message?: string } } | null)?.error;
  return new ApiClientError(status, error?.code ?? "unknown", error?.message ?? fallback, body);
}

/** Fetches our JSON API and turns the error shape into a thrown ApiClientError. */
export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, {
    ...init,
    headers: {
      Accept: "application/json",
      ...(init?.body && typeof init.body === "string" ? { "Content-Type": "application/json" } : {}),
      ...init?.headers,
    },
  });
  const body = await response.json().catch(() => null);
  if (!response.ok) throw apiErrorFrom(response.status, body);
  return body as T;
}
