import { type NextRequest, NextResponse } from "next/server";
import { getToken } from "next-auth/jwt";
import { methodRefusal } from "@/lib/api/methods";
import { contentSecurityPolicy, runtimeSecurityHeaders, servedOverHttps, withHeaders } from "@/lib/security/headers";

/**
 * Runs before Next.js answers, for three jobs and nothing else (authorisation is the guard's):
 * 1. the security headers that depend on the request: a fresh CSP nonce for each page, HSTS;
 * 2. methods an address does not answer get 405 with Allow (lib/api/refuse-methods.ts already
 *    refuses them where Node hands requests over; this is the same rule again, should the app run
 *    without that hook);
 * 3. signed-out visitors of app pages go to the sign-in page.
 */

// Static files, the sign-in page, the pages a mailed link opens (accepting an invitation, choosing
// a new password) and the API (which answers 401 itself) need no session.
const PUBLIC_PATH =
  /^\/(?:_next\/|sign-in(?:\/|$)|forgot-password(?:\/|$)|reset-password\/|invitations\/|icon\.svg$|favicon\.ico$)/;

function nonce(): string {
  return btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(16))));
}

export async function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;
  const api = pathname === "/api" || pathname.startsWith("/api/");
  const https = servedOverHttps(process.env.NEXTAUTH_URL);
  const headers = runtimeSecurityHeaders({ api, https });
  const answer = (response: NextResponse) => withHeaders(response, headers);

  const refusal = methodRefusal(request.method, pathname, { serverAction: request.headers.has("next-action") });
  if (refusal) {
    const response = new NextResponse(refusal.body, {
      status: refusal.status,
      headers: { "content-type": refusal.contentType },
    });
    if (refusal.allow) response.headers.set("Allow", refusal.allow.join(", "));
    return answer(response);
  }
  if (api) return answer(NextResponse.next());

  // Next.js takes the nonce from the request's policy and puts it on the scripts it renders.
  const policy = contentSecurityPolicy({ nonce: nonce(), dev: process.env.NODE_ENV === "development", https });
  headers["Content-Security-Policy"] = policy;

  if (!PUBLIC_PATH.test(pathname) && !(await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET }))) {
    const url = request.nextUrl.clone();
    const next = pathname + request.nextUrl.search;
    url.pathname = "/sign-in";
    url.search = next && next !== "/" ? `?next=${encodeURIComponent(next)}` : "";
    return answer(NextResponse.redirect(url));
  }
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("Content-Security-Policy", policy);
  return answer(NextResponse.next({ request: { headers: requestHeaders } }));
}

export const config = {
  matcher: [
    // Every page and static file.
    "/((?!api/).*)",
    // API requests without a body only: for a request with one, Next.js would read the whole
    // body before the proxy runs (and cut it at 10 MB), defeating the handlers' own limits.
    // Those are answered by the handlers, whose responses carry the same headers (withApi).
    {
      source: "/api/:path*",
      missing: [
        { type: "header", key: "content-length" },
        { type: "header", key: "transfer-encoding" },
      ],
    },
  ],
};
