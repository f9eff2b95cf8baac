/** A scripted browser-less client: csrf, credentials callback, then cookie-carrying requests. */
export class HttpSession {
  private cookies = new Map<string, string>();
  constructor(readonly baseUrl: string) {}

  private remember(response: Response) {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1));
    }
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
    return { status: response.status, signedIn: [...this.cookies.keys()].some((k) => k.endsWith("next-auth.session-token")) };
  }
}
