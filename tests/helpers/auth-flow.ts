import { createRequire } from "node:module";
import { NextRequest } from "next/server";

/**
 * next-auth's route handler and getServerSession read the request through next/headers, which
 * only answers inside Next. `replaceNextHeaders()` swaps that module for this one, and
 * `BrowserJar` fills it in for each request it sends, so the real next-auth, JWT and guard run
 * in-process.
 */
const current = { headers: new Headers() };

export const headersMock = {
  headers: async () => current.headers,
  cookies: async () => ({
    getAll: () =>
      (current.headers.get("cookie") ?? "")
        .split(";")
        .map((pair) => pair.trim())
        .filter(Boolean)
        // Next's cookies() hands values over decoded.
        .map((pair) => ({
          name: pair.slice(0, pair.indexOf("=")),
          value: decodeURIComponent(pair.slice(pair.indexOf("=") + 1)),
        })),
  }),
};

/** next-auth loads next/headers with require(), out of vi.mock's reach: replace it in Node's cache. */
export function replaceNextHeaders() {
  const require = createRequire(import.meta.url);
  const path = require.resolve("next/headers", { paths: [require.resolve("next-auth")] });
  require.cache[path] = { id: path, filename: path, loaded: true, exports: headersMock } as NodeJS.Module;
}

type AuthHandler = (request: NextRequest, context: { params: Promise<{ nextauth: string[] }> }) => Promise<Response>;
type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** A cookie jar that signs in, calls handlers and signs out the way a browser would. */
export class BrowserJar {
  cookies = new Map<string, string>();
  /** Every Set-Cookie line received, for checking cookie attributes. */
  setCookies: string[] = [];

  constructor(
    private readonly auth: { GET: AuthHandler; POST: AuthHandler },
    private readonly origin = "http://test.local",
  ) {}

  /** Another browser holding copies of this one's cookies. */
  copy(): BrowserJar {
    const other = new BrowserJar(this.auth, this.origin);
    other.cookies = new Map(this.cookies);
    return other;
  }

  get cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  private request(path: string, init: { method?: string; form?: Record<string, string> } = {}) {
    const headers = new Headers({ host: new URL(this.origin).host, cookie: this.cookieHeader });
    if (init.form) headers.set("content-type", "application/x-www-form-urlencoded");
    current.headers = headers;
    return new NextRequest(this.origin + path, {
      method: init.method ?? "GET",
      headers,
      body: init.form ? new URLSearchParams(init.form).toString() : undefined,
    });
  }

  private remember(response: Response) {
    for (const line of response.headers.getSetCookie()) {
      this.setCookies.push(line);
      const [pair] = line.split(";");
      const name = pair.slice(0, pair.indexOf("=")).trim();
      const value = pair.slice(pair.indexOf("=") + 1);
      if (value === "" || /max-age=0\b/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return response;
  }

  private async authCall(method: "GET" | "POST", path: string, form?: Record<string, string>) {
    const request = this.request(`/api/auth/${path}`, { method, form });
    const context = { params: Promise.resolve({ nextauth: path.split("?")[0].split("/") }) };
    return this.remember(await this.auth[method](request, context));
  }

  private async csrfToken(): Promise<string> {
    return (await (await this.authCall("GET", "csrf")).json()).csrfToken;
  }

  get signedIn() {
    return [...this.cookies.keys()].some((name) => name.endsWith("next-auth.session-token"));
  }

  async signIn(email: string, password = "changewise-demo") {
    const csrfToken = await this.csrfToken();
    await this.authCall("POST", "callback/credentials", { csrfToken, email, password, json: "true" });
    return this.signedIn;
  }

  async signOut() {
    const csrfToken = await this.csrfToken();
    return this.authCall("POST", "signout", { csrfToken, json: "true" });
  }

  /** Calls an app route handler with this jar's cookies; returns status and JSON. */
  async call(handler: Handler, path: string, params: Record<string, string> = {}) {
    const response = this.remember(await handler(this.request(path), { params: Promise.resolve(params) }));
    return { status: response.status, json: await response.json().catch(() => null) };
  }
}
