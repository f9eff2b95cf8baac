import { eq } from "drizzle-orm";
import { vi } from "vitest";
import { getDb } from "@/db/client";
import { users } from "@/db/schema";
import { userIdOf } from "./db";

/**
 * Route handlers read the signed-in user through lib/auth/session. Tests replace that one
 * function (the token's claims); everything after it (is the session still current? membership,
 * role, reach) runs for real.
 * Use with: vi.mock("@/lib/auth/session", () => sessionMock);
 */
export const signedIn = { userId: null as number | null, sessionVersion: 0 };

export const sessionMock = {
  currentSession: vi.fn(async () =>
    signedIn.userId === null ? null : { userId: signedIn.userId, sessionVersion: signedIn.sessionVersion },
  ),
};

/** Holds a token for this user as a fresh sign-in would: with their current session version. */
export async function signInAs(email: string | null) {
  if (email === null) {
    signedIn.userId = null;
    return;
  }
  signedIn.userId = await userIdOf(email);
  const [row] = await getDb().select({ v: users.sessionVersion }).from(users).where(eq(users.id, signedIn.userId));
  signedIn.sessionVersion = row.v;
}

type Handler<P> = (request: Request, context: { params: Promise<P> }) => Promise<Response>;

/** Calls a route handler the way Next does, and returns status and parsed JSON. */
export async function call<P extends Record<string, string>>(
  handler: Handler<P>,
  {
    url = "http://test.local/api",
    params = {} as P,
    method = "GET",
    body,
    headers = {},
  }: {
    url?: string;
    params?: P;
    method?: string;
    body?: unknown;
    headers?: Record<string, string>;
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
