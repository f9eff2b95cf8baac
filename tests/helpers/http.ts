/** A scripted browser-less client: csrf, credentials callback, then cookie-carrying requests. */
export class HttpSession {
  private cookies = new Map<string, string>();
  constructor(readonly baseUrl: string) {}

  private remember(response: Response) {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1);
      // A cleared cookie comes back empty (and expired): the browser forgets it.
      if (value === "") this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  /** Another client holding copies of this one's cookies (as if they had been copied out). */
  copy(): HttpSession {
    const other = new HttpSession(this.baseUrl);
    other.cookies = new Map(this.cookies);
    return other;
  }

  get signedIn() {
    return [...this.cookies.keys()].some((k) => k.endsWith("next-auth.session-token"));
  }

  get cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  async fetch(path: string, init: RequestInit = {}) {
    const response = await fetch(this.baseUrl + path, {
      redirect: "manual",
      ...init,
      headers: { cookie: this.cookieHeader, ...(init.headers as Record<string, string>) },
    });
    this.remember(response);
    return response;
  }

  async json(path: string, init: RequestInit = {}) {
    const response = await this.fetch(path, init);
    return { status: response.status, json: await response.json().catch(() => null) };
  }

  async signIn(email: string, password = "changewise-demo") {
    const { json } = await this.json("/api/auth/csrf");
    const body = new URLSearchParams({ csrfToken: json.csrfToken, email, password, json: "true" });
    const response = await this.fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body,
    });
    return { status: response.status, signedIn: this.signedIn };
  }

  /** What the sign-out button does: POST /api/auth/signout with the csrf token. */
  async signOut() {
    const { json } = await this.json("/api/auth/csrf");
    const body = new URLSearchParams({ csrfToken: json.csrfToken, callbackUrl: "/sign-in", json: "true" });
    return this.fetch("/api/auth/signout", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body,
    });
  }
}
