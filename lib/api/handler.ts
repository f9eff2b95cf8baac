import { NextResponse } from "next/server";
import { ZodError, type ZodType } from "zod";
import { ApiError, type FieldErrors, invalidInput, notFound } from "@/lib/errors";
import { canonicalId } from "@/lib/ids";
import { runtimeSecurityHeaders, servedOverHttps, withHeaders } from "@/lib/security/headers";

function zodFieldErrors(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.join(".") || "_";
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

/** A body that cannot fail to build: the answer when even the error response could not be made. */
const INTERNAL_BODY = JSON.stringify({
  error: { code: "internal", message: "Something went wrong on our side. Nothing was changed." },
});
const internalError = () =>
  new Response(INTERNAL_BODY, { status: 500, headers: { "content-type": "application/json" } });

/** Logs without letting the log itself fail (a throwing getter, a huge message) or flood the log. */
function logSafely(label: string, error: unknown) {
  try {
    console.error(label, error);
  } catch {
    try {
      const text = error instanceof Error ? `${error.name}: ${error.message}` : typeof error;
      console.error(label, text.slice(0, 500));
    } catch {
      // Nothing is left to report with; the 500 still goes out.
    }
  }
}

function buildErrorResponse(error: unknown): Response {
  if (error instanceof ApiError) return NextResponse.json(error.toBody(), { status: error.status });
  if (error instanceof ZodError) {
    return NextResponse.json(invalidInput("Some fields need attention.", zodFieldErrors(error)).toBody(), {
      status: 422,
    });
  }
  logSafely("Unhandled API error", error);
  return internalError();
}

/** The one error shape for any failure; never throws (if the answer cannot be built, a fixed 500). */
export function errorResponse(error: unknown): Response {
  try {
    return buildErrorResponse(error);
  } catch (failure) {
    // E.g. an error list too large to serialise (RangeError: Invalid string length).
    logSafely("Could not build the error response", failure);
    return internalError();
  }
}

type RouteContext<P> = { params: Promise<P> };

function hostOf(url: string | undefined | null): string | null {
  try {
    return url ? new URL(url).host : null;
  } catch {
    return null;
  }
}

/**
 * Session cookies are SameSite=Lax already; as a second line, a change sent by a browser
 * from another site (its Origin names another host) is refused.
 */
function assertSameOrigin(request: Request) {
  if (request.method === "GET" || request.method === "HEAD") return;
  const origin = request.headers.get("origin");
  if (!origin) return;
  // Behind a proxy the Host header may name the proxy's upstream, so the public URL counts too.
  const ours = [
    request.headers.get("host"),
    request.headers.get("x-forwarded-host"),
    new URL(request.url).host,
    hostOf(process.env.NEXTAUTH_URL),
  ];
  const from = hostOf(origin);
  if (!from || !ours.includes(from)) throw new ApiError(403, "forbidden", "Changes must come from Changewise itself.");
}

/** Wraps a route handler so every failure leaves as the one error shape. */
export function withApi<P = Record<string, string>>(
  handler: (request: Request, context: RouteContext<P>) => Promise<Response>,
) {
  return async (request: Request, context: RouteContext<P>): Promise<Response> => {
    let response: Response;
    try {
      assertSameOrigin(request);
      response = await handler(request, context);
    } catch (error) {
      response = errorResponse(error);
    }
    return secureApiResponse(response);
  };
}

/**
 * The headers every API answer carries that next.config.ts cannot give: HSTS depends on the URL
 * the app runs at, and requests with a body never pass through proxy.ts.
 */
export function secureApiResponse(response: Response): Response {
  return withHeaders(response, runtimeSecurityHeaders({ api: true, https: servedOverHttps(process.env.NEXTAUTH_URL) }));
}

/** The largest JSON body any route takes (a 5000-cell sheet save is well under 1 MB). */
const MAX_JSON_BYTES = 2 * 1024 * 1024;

/**
 * Reads the body, stopping as soon as it passes `max` bytes: neither a missing nor a false
 * Content-Length gets a larger body into memory.
 */
export async function readCappedBytes(request: Request, max: number, tooLargeMessage: string): Promise<Uint8Array> {
  const tooLarge = () => new ApiError(413, "payload_too_large", tooLargeMessage);
  if (Number(request.headers.get("content-length") ?? 0) > max) throw tooLarge();
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let part: ReadableStreamReadResult<Uint8Array>;
    try {
      part = await reader.read();
    } catch {
      throw new ApiError(400, "bad_request", "The request was interrupted before it was complete. Try again.");
    }
    if (part.done) break;
    total += part.value.byteLength;
    if (total > max) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(part.value);
  }
  return Buffer.concat(chunks);
}

/** Reads a JSON body and validates it; malformed JSON is a 400 and an oversized one a 413, never a 500. */
export async function readJson<T>(request: Request, schema: ZodType<T>): Promise<T> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.includes("application/json")) {
    throw new ApiError(415, "unsupported_media_type", "Send the body as JSON (Content-Type: application/json).");
  }
  const bytes = await readCappedBytes(
    request,
    MAX_JSON_BYTES,
    "The request is larger than 2 MB. Send fewer results at once.",
  );
  const text = new TextDecoder().decode(bytes);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new ApiError(400, "bad_request", "The body is not valid JSON.");
  }
  return schema.parse(body);
}

/** Parses an id from the path or the query string; anything but a canonical positive integer cannot exist. */
export function parseId(value: string | null | undefined, what = "That record"): number {
  const id = canonicalId(value);
  if (id === null) throw notFound(what);
  return id;
}

export function json<T>(data: T, init?: ResponseInit) {
  return NextResponse.json(data, init);
}
