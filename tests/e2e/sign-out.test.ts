import { describe, expect, inject, it } from "vitest";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

/** A signed-out page visit: a redirect to sign-in, before or (streamed) after the first byte. */
async function sentToSignIn(response: Response): Promise<boolean> {
  if (response.status >= 300 && response.status < 400)
    return (response.headers.get("location") ?? "").includes("/sign-in");
  const html = await response.text();
  return /__next-page-redirect[^>]*url=\/sign-in|NEXT_REDIRECT;[^"]*\/sign-in/.test(html);
}

describe("sign-out over HTTP against the production build", () => {
  it("a session cookie copied before sign-out no longer works after it", async () => {
    const browser = new HttpSession(baseUrl);
    expect((await browser.signIn("coach@example.com")).signedIn).toBe(true);
    expect((await browser.json("/api/me")).status).toBe(200);
    const copied = browser.copy();
    expect((await copied.json("/api/me")).status).toBe(200);

    const signOut = await browser.signOut();
    expect(signOut.status).toBe(200);
    expect(browser.signedIn).toBe(false);

    expect(copied.signedIn).toBe(true);
    expect((await copied.json("/api/me")).status).toBe(401);
    expect(await sentToSignIn(await copied.fetch("/"))).toBe(true);
  });

  it("signing in again after sign-out gives a working session", async () => {
    const browser = new HttpSession(baseUrl);
    await browser.signIn("coach@example.com");
    await browser.signOut();
    expect((await browser.signIn("coach@example.com")).signedIn).toBe(true);
    expect((await browser.json("/api/me")).status).toBe(200);
  });

  it("the session cookie is HttpOnly and, over plain http, not Secure (so local use keeps working)", async () => {
    const browser = new HttpSession(baseUrl);
    const { json } = await browser.json("/api/auth/csrf");
    const response = await browser.fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({
        csrfToken: json.csrfToken,
        email: "scientist@example.com",
        password: "changewise-demo",
        json: "true",
      }),
    });
    const line = response.headers.getSetCookie().find((l) => l.startsWith("next-auth.session-token=")) ?? "";
    expect(line).toMatch(/;\s*HttpOnly/i);
    expect(line).not.toMatch(/;\s*Secure/i);
  });
});
