/**
 * Security headers, in one place for next.config.ts (static headers on every response), proxy.ts
 * (the per-request nonce policy and HSTS) and the API handlers. A plain module: next.config.ts
 * loads it outside the app bundle.
 */

/** True when the public URL is https: secure cookies, HSTS and upgrading insecure requests. */
export function servedOverHttps(publicUrl: string | undefined): boolean {
  return publicUrl?.trim().toLowerCase().startsWith("https://") ?? false;
}

type PolicyOptions = { nonce?: string; dev?: boolean; https?: boolean };

/**
 * The Content-Security-Policy of a page. Scripts run only with this response's nonce, and
 * whatever those scripts load ('strict-dynamic': the framework's chunks). Next.js reads the nonce
 * from this header on the request and puts it on every script it writes, so the page must be
 * rendered per request (app/layout.tsx). Without a nonce no inline script runs at all: that is
 * the policy of responses the proxy does not see.
 *
 * Styles allow 'unsafe-inline': React writes `style` attributes into server-rendered HTML (a
 * progress bar's width, the global error screen), which a nonce cannot cover, and injected CSS
 * cannot run code. 'unsafe-eval' only in development, where React rebuilds server stacks with
 * eval; production needs none.
 */
export function contentSecurityPolicy({ nonce, dev = false, https = false }: PolicyOptions = {}): string {
  const scripts = [
    "'self'",
    ...(nonce ? [`'nonce-${nonce}'`, "'strict-dynamic'"] : []),
    ...(dev ? ["'unsafe-eval'"] : []),
  ];
  return [
    "default-src 'self'",
    `script-src ${scripts.join(" ")}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    // The development server's hot reload talks over a websocket.
    `connect-src 'self'${dev ? " ws: wss:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    // No other site may frame any page (clickjacking the sign-in form, the Session sheet).
    "frame-ancestors 'none'",
    ...(https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

/** API answers are data, never documents: they may load nothing and be framed nowhere. */
export const API_CONTENT_SECURITY_POLICY =
  "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** The same on every response, whoever answers it. */
export const STATIC_SECURITY_HEADERS: Readonly<Record<string, string>> = {
  "X-Content-Type-Options": "nosniff",
  // Same-origin requests keep their Referer (and POSTs their Origin, which the API checks);
  // other sites never see our URLs, which hold record ids.
  "Referrer-Policy": "same-origin",
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=()",
  // For browsers that predate frame-ancestors.
  "X-Frame-Options": "DENY",
  "Cross-Origin-Opener-Policy": "same-origin",
};

/** Two years, subdomains included: the usual value once a site is https-only. */
export const HSTS = "max-age=63072000; includeSubDomains";

/**
 * Headers that depend on where the app is served (known only when it runs, not when it is
 * built): HSTS over https; API answers carry personal data, so nothing stores them.
 */
export function runtimeSecurityHeaders({ api, https }: { api: boolean; https: boolean }): Record<string, string> {
  return {
    ...(https ? { "Strict-Transport-Security": HSTS } : {}),
    ...(api ? { "Cache-Control": "no-store", "Content-Security-Policy": API_CONTENT_SECURITY_POLICY } : {}),
  };
}

/** Sets headers on a response; a response with immutable headers is copied first. */
export function withHeaders(response: Response, headers: Record<string, string>): Response {
  try {
    for (const [key, value] of Object.entries(headers)) response.headers.set(key, value);
    return response;
  } catch {
    const copy = new Response(response.body, {
      status: response.status,
      statusText: response.statusText,
      headers: response.headers,
    });
    for (const [key, value] of Object.entries(headers)) copy.headers.set(key, value);
    return copy;
  }
}
