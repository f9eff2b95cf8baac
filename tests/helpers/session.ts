import { vi } from "vitest";
import { userIdOf } from "./db";

/**
 * Route handlers read the signed-in user through lib/auth/session. Tests replace
 * that one function; everything after it (membership, role, reach) runs for real.
 * Use with: vi.mock("@/lib/auth/session", () => sessionMock);
 */
export const signedIn = { userId: null as number | null };

export const sessionMock = { currentUserId: vi.fn(async () => signedIn.userId) };

export async function signInAs(email: string | null) {
  signedIn.userId = email === null ? null : await userIdOf(email);
}

type Handler<P> = (request: Request, context: { params: Promise<P> }) => Promise<Response>;

/** Calls a route handler the way Next does, and returns status and parsed JSON. */
export async function call<P extends Record<string, string>>(
  handler: Handler<P>,
  { url = "http://test.local/api", params = {} as P, method = "GET", body, headers = {} }: {
    url?: string; params?: P; method?: string; body?: unknown; headers?: Record<string, string>;
  } = {},
) {
  const init: RequestInit = { method, headers: { ...headers } };
  if (body !== undefined) {
    if (body instanceof FormData || typeof body === "string") init.body = body as BodyInit;
    else {
      init.body = JSON.stringify(body);
      (init.headers as Record<string, string>)["content-type"] = "application/json";
    }
  }
  const response = await handler(new Request(url, init), { params: Promise.resolve(params) });
  const text = await response.text();
  let json: any = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  return { status: response.status, json, headers: response.headers };
}
