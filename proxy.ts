import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";
import { allowedMethods } from "@/lib/api/methods";
import { contentSecurityPolicy, runtimeSecurityHeaders, servedOverHttps, withHeaders } from "@/lib/security/headers";

/**
 * Runs before Next.js answers, for three jobs and nothing else (authorisation is the guard's):
 * 1. the security headers that depend on the request: a fresh CSP nonce for each page, HSTS;
 * 2. methods an address does not answer get 405 with Allow (TRACE and TRACK never get here:
 *    lib/api/refuse-methods.ts answers them);
 * 3. signed-out visitors of app pages go to the sign-in page.
 */

const isServerAction = (request: NextRequest) => request.method === "POST" && request.headers.has("next-action");

// Static files, the sign-in page and the API (which answers 401 itself) need no session.
const PUBLIC_PATH = /^\/(?:_next\/|sign-in(?:\/|$)|icon\.svg$|favicon\.ico$)/;

function nonce(): string {
  return btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(16))));
}

function methodNotAllowed(allow: string[], api: boolean): NextResponse {
  const message = "This address does not answer that method.";
  const response = api
    ? NextResponse.json({ error: { code: "method_not_allowed", message } }, { status: 405 })
    : new NextResponse("Method Not Allowed", { status: 405, headers: { "content-type": "text/plain; charset=utf-8" } });
  response.headers.set("Allow", allow.join(", "));
  return response;
}

export async function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;
  const api = pathname === "/api" || pathname.startsWith("/api/");
  const https = servedOverHttps(process.env.NEXTAUTH_URL);
  const headers = runtimeSecurityHeaders({ api, https });
  const answer = (response: NextResponse) => withHeaders(response, headers);

  const allow = allowedMethods(pathname);
  if (!allow) return answer(NextResponse.json({ error: { code: "not_found", message: "There is no such API address." } }, { status: 404 }));
  if (!allow.includes(request.method) && !isServerAction(request)) return answer(methodNotAllowed(allow, api));
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
