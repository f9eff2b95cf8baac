/**
 * TRACE is refused where Node's HTTP server hands a request to Next.js. It cannot be refused
 * later: to run proxy.ts, Next.js builds a fetch Request, and fetch forbids TRACE, TRACK and
 * CONNECT (its constructor throws), so Next.js would answer 500 before any code of ours runs.
 * The other two never get this far: Node's parser does not know TRACK (it answers 400 itself), and
 * CONNECT has no listener, so Node closes the connection. Installed at start-up by instrumentation.ts.
 */
import "server-only";
import http from "node:http";
import { API_CONTENT_SECURITY_POLICY, runtimeSecurityHeaders, servedOverHttps, STATIC_SECURITY_HEADERS } from "@/lib/security/headers";
import { allowedMethods } from "./methods";

const REFUSED = new Set(["TRACE"]);
const installed = Symbol.for("changewise.refuse-methods");

function refuse(request: http.IncomingMessage, response: http.ServerResponse) {
  const pathname = (request.url ?? "/").split("?")[0];
  const allow = allowedMethods(pathname);
  // Whatever body came with it is read and dropped; the connection closes after the answer.
  request.resume();
  response.writeHead(allow ? 405 : 404, {
    ...STATIC_SECURITY_HEADERS,
    ...runtimeSecurityHeaders({ api: true, https: servedOverHttps(process.env.NEXTAUTH_URL) }),
    "Content-Security-Policy": API_CONTENT_SECURITY_POLICY,
    ...(allow ? { Allow: allow.join(", ") } : {}),
    "Content-Type": "text/plain; charset=utf-8",
    Connection: "close",
  });
  response.end(allow ? "Method Not Allowed" : "Not Found");
}

/** Answers TRACE on every HTTP server of this process; returns a function that undoes it. */
export function refuseUnsupportedMethods(): () => void {
  const proto = http.Server.prototype as http.Server & { [installed]?: boolean };
  if (proto[installed]) return () => undefined;
  const emit = proto.emit;
  proto.emit = function (this: http.Server, event: string | symbol, ...args: unknown[]) {
    if (event === "request") {
      const [request, response] = args as [http.IncomingMessage, http.ServerResponse];
      if (REFUSED.has(request.method ?? "")) {
        refuse(request, response);
        return true;
      }
    }
    return (emit as (this: http.Server, event: string | symbol, ...rest: unknown[]) => boolean).call(this, event, ...args);
  } as typeof emit;
  proto[installed] = true;
  return () => {
    proto.emit = emit;
    delete proto[installed];
  };
}
