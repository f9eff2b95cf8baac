/**
 * Methods an address does not answer are refused where Node's HTTP server hands the request to
 * Next.js, before Next.js reads anything. Later is too late for two kinds of request:
 * - TRACE: to run proxy.ts, Next.js builds a fetch Request, fetch forbids TRACE (its constructor
 *   throws) and Next.js answers 500 before any code of ours runs;
 * - requests with a body skip proxy.ts (see its matcher), and for a method a route does not export
 *   Next.js answers 405 without the Allow header RFC 9110 requires.
 * TRACK and CONNECT never get this far: Node's parser does not know TRACK (it answers 400 itself),
 * and CONNECT has no listener, so Node closes the connection.
 * Installed at start-up by instrumentation.ts.
 */
import "server-only";
import http from "node:http";
import {
  API_CONTENT_SECURITY_POLICY,
  runtimeSecurityHeaders,
  STATIC_SECURITY_HEADERS,
  servedOverHttps,
} from "@/lib/security/headers";
import { methodRefusal } from "./methods";

const installed = Symbol.for("changewise.refuse-methods");

/** Answers the request if its method is refused; true when it did. */
function refused(request: http.IncomingMessage, response: http.ServerResponse): boolean {
  const pathname = (request.url ?? "/").split("?")[0];
  const refusal = methodRefusal(request.method ?? "", pathname, {
    serverAction: Boolean(request.headers["next-action"]),
  });
  if (!refusal) return false;
  response.writeHead(refusal.status, {
    ...STATIC_SECURITY_HEADERS,
    ...runtimeSecurityHeaders({ api: true, https: servedOverHttps(process.env.NEXTAUTH_URL) }),
    "Content-Security-Policy": API_CONTENT_SECURITY_POLICY,
    ...(refusal.allow ? { Allow: refusal.allow.join(", ") } : {}),
    "Content-Type": refusal.contentType,
    // Whatever body was sent is not read; the connection ends with the answer.
    Connection: "close",
  });
  response.end(refusal.body);
  return true;
}

/** Refuses methods before Next.js on every HTTP server of this process; returns a function that undoes it. */
export function refuseUnsupportedMethods(): () => void {
  const proto = http.Server.prototype as http.Server & { [installed]?: boolean };
  if (proto[installed]) return () => undefined;
  const emit = proto.emit as (this: http.Server, event: string | symbol, ...rest: unknown[]) => boolean;
  proto.emit = function (this: http.Server, event: string | symbol, ...args: unknown[]) {
    if (event === "request" && refused(args[0] as http.IncomingMessage, args[1] as http.ServerResponse)) return true;
    return emit.call(this, event, ...args);
  } as typeof proto.emit;
  proto[installed] = true;
  return () => {
    proto.emit = emit as typeof proto.emit;
    delete proto[installed];
  };
}
