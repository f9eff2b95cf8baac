import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("sign-in over HTTP against the production build", () => {
  it("all five demo accounts sign in and /api/me shows the right role", async () => {
    const expected: Record<string, string> = {
      "owner@example.com": "owner",
      "scientist@example.com": "scientist",
      "coach@example.com": "coach",
      "athlete@example.com": "athlete",
      "owner@other.example.com": "owner",
    };
    for (const [email, role] of Object.entries(expected)) {
      const session = new HttpSession(baseUrl);
      expect((await session.signIn(email)).signedIn).toBe(true);
      const { status, json } = await session.json("/api/me");
      expect(status).toBe(200);
      expect(json.role).toBe(role);
      expect(json.user.email).toBe(email);
    }
  });

  it("a wrong password gives no session; anonymous API calls get 401; pages redirect to sign-in", async () => {
    const session = new HttpSession(baseUrl);
    expect((await session.signIn("coach@example.com", "wrong-password")).signedIn).toBe(false);
    expect((await session.json("/api/me")).status).toBe(401);
    const page = await session.fetch("/");
    expect(page.status).toBe(307);
    expect(page.headers.get("location")).toContain("/sign-in");
  });
});

describe("sign-in in the browser", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => browser?.close());

  it("a coach signs in through the form and sees only their squad", async () => {
    const page = await browser.context.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await screenshot(page, "sign-in");
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.getByRole("cell", { name: /Academy U18/ }).waitFor();
    expect(await page.getByText("Senior Women").count()).toBe(0);
    await screenshot(page, "home-coach");
    await page.close();
  });

  it("a wrong password shows a clear message", async () => {
    const page = await browser.context.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel("E-mail").fill("owner@example.com");
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("do not match an account").waitFor();
    await page.close();
  });

  it("after five failures in a minute the form says to wait", async () => {
    const page = await browser.context.newPage();
    // An account of its own: only that e-mail is held. The server declares no proxy, so forwarded
    // headers are ignored and the address limit (one shared bucket) does not apply.
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel("E-mail").fill("former.coach@example.com");
    for (let i = 0; i < 5; i++) {
      await page.getByLabel("Password").fill(`guess-${i}`);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.getByText("do not match an account").waitFor();
      await page.getByRole("button", { name: "Sign in" }).and(page.locator(":enabled")).waitFor();
    }
    await page.getByLabel("Password").fill("guess-5");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("Too many failed sign-ins. Wait a minute, then try again.").waitFor();
    await screenshot(page, "sign-in-throttled");
    await page.close();
  });
});
