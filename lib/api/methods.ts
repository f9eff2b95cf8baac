/**
 * The HTTP methods each address answers, so that any other method gets 405 with the Allow header
 * (RFC 9110 §15.5.6) before Next.js routes it: where Node hands requests to Next.js
 * (lib/api/refuse-methods.ts, which alone sees TRACE and requests with a body) and again in
 * proxy.ts. tests/unit/api-methods.test.ts checks the API list against the route files' exports.
 */
export const ROUTE_METHODS = {
  "auth/[...nextauth]": ["GET", "POST"],
  me: ["GET"],
  "me/progress": ["GET"],
  "me/export": ["GET"],
  athletes: ["GET"],
  "athletes/[athleteId]": ["GET", "PATCH", "DELETE"],
  "athletes/[athleteId]/deletion": ["GET"],
  "athletes/[athleteId]/results": ["GET"],
  "athletes/[athleteId]/history": ["GET"],
  coaches: ["GET"],
  squads: ["GET", "POST"],
  "squads/[squadId]": ["GET", "PATCH"],
  "squads/[squadId]/athletes": ["GET", "POST"],
  tests: ["GET", "POST"],
  "tests/[testId]": ["GET", "PATCH", "DELETE"],
  "tests/[testId]/typical-error": ["POST"],
  sessions: ["GET", "POST"],
  "sessions/[sessionId]": ["GET", "PATCH", "DELETE"],
  "sessions/[sessionId]/results": ["PUT"],
  "sessions/[sessionId]/undo": ["POST"],
  "sessions/[sessionId]/audit": ["GET"],
  "sessions/[sessionId]/import": ["POST"],
  "sessions/[sessionId]/publish-check": ["GET"],
  "reports/change": ["GET"],
  "reports/change.csv": ["GET"],
  "reports/reliability": ["GET"],
  "reports/reliability/file": ["POST"],
  "reports/notes": ["GET", "POST"],
  "reports/notes/[reportId]": ["GET"],
  "work-to-do": ["GET"],
  // The fixed address before the one with an id, which would match "accept" too.
  "invitations/accept": ["POST"],
  invitations: ["GET", "POST"],
  "invitations/[invitationId]": ["DELETE"],
  "invitations/[invitationId]/resend": ["POST"],
  "password-reset": ["POST"],
  "password-reset/confirm": ["POST"],
  members: ["GET"],
  "members/[userId]": ["GET", "PATCH", "DELETE"],
  "me/deletion-request": ["POST"],
  "deletion-requests": ["GET"],
  outbox: ["GET"],
  "outbox/[messageId]": ["GET"],
} as const satisfies Record<string, readonly string[]>;

const patternOf = (route: string) =>
  new RegExp(
    `^/api/${route
      .split("/")
      .map((part) => (part.startsWith("[...") ? ".+" : part.startsWith("[") ? "[^/]+" : part))
      .join("/")}/?$`,
  );

const ROUTES = Object.entries(ROUTE_METHODS).map(([route, methods]) => ({
  pattern: patternOf(route),
  methods: methods as readonly string[],
}));

/**
 * What the route at this path answers, as Next.js serves it: HEAD wherever there is GET, and
 * OPTIONS everywhere (Next.js implements both). Null when no API route has this path.
 */
export function allowedApiMethods(pathname: string): string[] | null {
  const route = ROUTES.find((r) => r.pattern.test(pathname));
  if (!route) return null;
  const methods = new Set([...route.methods, "OPTIONS", ...(route.methods.includes("GET") ? ["HEAD"] : [])]);
  return [...methods].sort();
}

/** Pages answer GET and HEAD (a server action would POST with a Next-Action header; none exist). */
export const PAGE_METHODS = ["GET", "HEAD"];

const isApi = (pathname: string) => pathname === "/api" || pathname.startsWith("/api/");
// Next.js's own addresses (static files, development tools) answer for themselves.
const isFramework = (pathname: string) => pathname.startsWith("/_next/") || pathname.startsWith("/__nextjs");

/** The methods an address answers: its API route's, or a page's. Null for an unknown API address. */
export function allowedMethods(pathname: string): string[] | null {
  return isApi(pathname) ? allowedApiMethods(pathname) : PAGE_METHODS;
}

export type Refusal = { status: 404 | 405; allow: string[] | null; contentType: string; body: string };

/**
 * Whether a request is answered before Next.js routes it: 405 with Allow for a method the address
 * does not take, 404 for an address no API route has. Null: hand it on.
 */
export function methodRefusal(method: string, pathname: string, { serverAction = false } = {}): Refusal | null {
  if (isFramework(pathname)) return null;
  const api = isApi(pathname);
  const allow = allowedMethods(pathname);
  if (allow && (allow.includes(method) || (!api && serverAction && method === "POST"))) return null;
  const status = allow ? 405 : 404;
  const message = allow ? "This address does not answer that method." : "There is no such API address.";
  return api
    ? {
        status,
        allow,
        contentType: "application/json",
        body: JSON.stringify({ error: { code: allow ? "method_not_allowed" : "not_found", message } }),
      }
    : { status, allow, contentType: "text/plain; charset=utf-8", body: allow ? "Method Not Allowed" : "Not Found" };
}
