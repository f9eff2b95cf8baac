/**
 * Every screen, as its users meet it: axe-core (WCAG 2.2 A and AA rules) finds no violation, and
 * the page never scrolls sideways — staff screens at 1280 px and on an 820 px tablet, the
 * athlete's at 390 px on a phone (PRODUCT.md §7). Screenshots land in tests/.artifacts/.
 */
import { createRequire } from "node:module";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";
import { linkIn, waitForMail } from "../helpers/outbox-files";

const baseUrl = inject("baseUrl");
const outboxDir = inject("outboxDir");
const axePath = createRequire(import.meta.url).resolve("axe-core/axe.min.js");

type Violation = { id: string; impact: string | null; nodes: { target: string[] }[] };

async function audit(page: Page, name: string) {
  await page.addScriptTag({ path: axePath });
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: unknown[] }> } }
    ).axe;
    const result = await axe.run(document, {
      runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"] },
    });
    return result.violations;
  });
  const sideways = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  await screenshot(page, name);
  return {
    violations: (violations as Violation[]).map(
      (v) =>
        `${v.id} (${v.impact}) ×${v.nodes.length}: ${v.nodes
          .slice(0, 3)
          .map((n) => n.target.join(" "))
          .join(", ")}`,
    ),
    sideways,
  };
}

describe("accessibility and fit of every screen", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let paths: string[] = [];
  /** The owner's own screens. */
  const ownerPaths = ["/people", "/outbox"];
  /** Signed-out pages a mailed link opens (a working invitation and reset link, and a spent one). */
  let linkPaths: string[] = [];

  beforeAll(async () => {
    browser = await openBrowser();
    const http = new HttpSession(baseUrl);
    await http.signIn("scientist@example.com");
    const sessions = (await http.json("/api/sessions")).json.sessions as { id: number }[];
    const squads = (await http.json("/api/squads")).json.squads as { id: number }[];
    const athletes = (await http.json("/api/athletes")).json.athletes as { id: number }[];
    paths = [
      "/",
      `/squads/${squads[0].id}`,
      `/athletes/${athletes[0].id}`,
      "/tests",
      "/sessions",
      `/sessions/${sessions[0].id}`,
      `/sessions/${sessions[0].id}/import`,
      "/reports/change",
      "/reports/reliability",
      "/reports/reliability/file",
    ];
    // Links to open on a phone: an invitation (the owner sends it) and a reset link (not used, so
    // the demo password stays).
    const owner = new HttpSession(baseUrl);
    await owner.signIn("owner@example.com");
    const invited = await owner.json("/api/invitations", {
      method: "POST",
      headers: { "content-type": "application/json", origin: baseUrl },
      body: JSON.stringify({ email: "a11y.invitee@example.com", role: "scientist" }),
    });
    expect(invited.status).toBe(201);
    const reset = await fetch(`${baseUrl}/api/password-reset`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: "coach@example.com" }),
    });
    expect(reset.status).toBe(202);
    const path = (link: string) => new URL(link).pathname;
    linkPaths = [
      path(linkIn(await waitForMail(outboxDir, "a11y.invitee@example.com", /^Join /), "invitations")),
      path(linkIn(await waitForMail(outboxDir, "coach@example.com", /^Reset /), "reset-password")),
      `/invitations/${"A".repeat(43)}`,
    ];
  });
  afterAll(() => browser?.close());

  // One test per width: axe on a dozen screens takes most of a minute on two cores.
  it.each([1280, 820])(
    "staff screens at %i px",
    async (width) => {
      const page = await browser.context.newPage();
      await signInThroughForm(page, baseUrl, "scientist@example.com");
      const problems: string[] = [];
      await page.setViewportSize({ width, height: 900 });
      for (const path of paths) {
        await page.goto(`${baseUrl}${path}`);
        await page.waitForSelector("h1");
        const name = `a11y-${width}-${path.replaceAll("/", "_") || "home"}`;
        const { violations, sideways } = await audit(page, name);
        problems.push(...violations.map((v) => `${width}px ${path}: ${v}`));
        if (sideways > 0) problems.push(`${width}px ${path}: scrolls sideways by ${sideways}px`);
      }
      await page.close();
      expect(problems).toEqual([]);
    },
    120_000,
  );

  it.each([1280, 820])(
    "owner screens at %i px",
    async (width) => {
      const page = await browser.context.newPage();
      await signInThroughForm(page, baseUrl, "owner@example.com");
      const problems: string[] = [];
      await page.setViewportSize({ width, height: 900 });
      for (const path of ownerPaths) {
        await page.goto(`${baseUrl}${path}`);
        await page.waitForSelector("h1");
        const { violations, sideways } = await audit(page, `a11y-${width}-${path.replaceAll("/", "_")}`);
        problems.push(...violations.map((v) => `${width}px ${path}: ${v}`));
        if (sideways > 0) problems.push(`${width}px ${path}: scrolls sideways by ${sideways}px`);
      }
      await page.close();
      expect(problems).toEqual([]);
    },
    60_000,
  );

  it("the pages a mailed link opens, and forgotten password, on a 390 px phone", async () => {
    const { context, close } = await openBrowser();
    const page = await context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    const problems: string[] = [];
    for (const [i, path] of ["/forgot-password", ...linkPaths].entries()) {
      await page.goto(`${baseUrl}${path}`);
      await page.waitForSelector("h1");
      const name = `a11y-390-${["forgot-password", "invitation", "reset-password", "invitation-spent"][i]}`;
      const { violations, sideways } = await audit(page, name);
      problems.push(...violations.map((v) => `390px ${path.slice(0, 20)}…: ${v}`));
      if (sideways > 0) problems.push(`390px ${path.slice(0, 20)}…: scrolls sideways by ${sideways}px`);
    }
    await page.close();
    await close();
    expect(problems).toEqual([]);
  });

  it("a coach's reading screens on a 390 px phone: no sideways scrolling of the page or a table", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signInThroughForm(page, baseUrl, "coach@example.com");
    const problems: string[] = [];
    const coach = new HttpSession(baseUrl);
    await coach.signIn("coach@example.com");
    const [own] = (await coach.json("/api/squads")).json.squads as { id: number }[];
    for (const path of ["/", `/squads/${own.id}`, "/tests", "/sessions"]) {
      await page.goto(`${baseUrl}${path}`);
      await page.waitForSelector("h1");
      const { violations, sideways } = await audit(page, `a11y-390-coach-${path.replaceAll("/", "_") || "home"}`);
      problems.push(...violations.map((v) => `390px ${path}: ${v}`));
      if (sideways > 0) problems.push(`390px ${path}: scrolls sideways by ${sideways}px`);
      // Below the sm breakpoint each row stacks, so no table scrolls inside its card either.
      const wideTables = await page.evaluate(
        () =>
          [...document.querySelectorAll("table")].filter((t) => t.scrollWidth > t.parentElement!.clientWidth).length,
      );
      if (wideTables > 0) problems.push(`390px ${path}: ${wideTables} table(s) scroll sideways`);
    }
    await page.close();
    expect(problems).toEqual([]);
  }, 120_000);

  it("sign-in and the athlete's home on a 390 px phone", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${baseUrl}/sign-in`);
    const signIn = await audit(page, "a11y-390-sign-in");
    await signInThroughForm(page, baseUrl, "athlete@example.com");
    await page.waitForSelector("h1");
    const home = await audit(page, "a11y-390-athlete-home");
    await page.close();
    expect([...signIn.violations, ...home.violations]).toEqual([]);
    expect(Math.max(signIn.sideways, home.sideways)).toBeLessThanOrEqual(0);
  });
});
