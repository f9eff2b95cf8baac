/**
 * My progress on a 390 px phone, as Tessa sees it once the scientist has published the Senior
 * post-block session: a Progress line per test with pixels drawn, dates on one line, no sideways
 * scrolling, axe-core clean; and her results mail in the local fake's outbox. Screenshots at 390
 * and 1280 px land in tests/.artifacts/.
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { readEml } from "@/lib/mail/eml";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");
const outboxDir = inject("outboxDir");
const axePath = createRequire(import.meta.url).resolve("axe-core/axe.min.js");

const http = new HttpSession(baseUrl);
let postBlock = 0;

async function setStatus(status: "published" | "draft") {
  const { json } = await http.json(`/api/sessions/${postBlock}`);
  const answer = await http.json(`/api/sessions/${postBlock}`, {
    method: "PATCH",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ status, version: json.session.version }),
  });
  expect(answer.status).toBe(200);
}

const mailsTo = (address: string) =>
  existsSync(outboxDir)
    ? readdirSync(outboxDir)
        .filter((f) => f.endsWith(".eml"))
        .map((f) => readEml(readFileSync(join(outboxDir, f), "utf8")))
        .filter((m) => m.to === address)
    : [];

async function axe(page: Page) {
  await page.addScriptTag({ path: axePath });
  const violations = (await page.evaluate(async () => {
    const run = (window as unknown as { axe: { run: (d: Document, o: object) => Promise<{ violations: unknown[] }> } })
      .axe;
    return (
      await run.run(document, {
        runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"] },
      })
    ).violations;
  })) as { id: string; nodes: { target: string[] }[] }[];
  return violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

/** Canvases with at least this many drawn pixels each (a blank chart has none). */
async function drawnPixels(page: Page) {
  return page.$$eval("figure canvas", (canvases) =>
    canvases.map((c) => {
      const canvas = c as HTMLCanvasElement;
      const data = canvas.getContext("2d")!.getImageData(0, 0, canvas.width, canvas.height).data;
      let drawn = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i] > 0) drawn++;
      return drawn;
    }),
  );
}

describe("My progress on a phone", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    await http.signIn("scientist@example.com");
    const { json } = await http.json("/api/sessions");
    postBlock = json.sessions.find(
      (s: { squadName: string; phase: string }) => s.squadName === "Senior Women" && s.phase === "post-block",
    ).id;
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    // Later files meet the demo as seeded.
    await setStatus("draft");
  });

  it("the publish dialog names who will not see their results and why; publishing shows the sheet's banner", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await page.goto(`${baseUrl}/sessions/${postBlock}`);
    await page.getByRole("button", { name: "Publish…" }).click();
    const dialog = page.getByRole("dialog", { name: "Publish this session?" });
    await dialog.getByText("Noor Balfour: no consent recorded").waitFor();
    await dialog.getByText(/Clío Nakashima: under 18 on the publish date and no guardian's consent recorded/).waitFor();
    expect(await dialog.textContent()).toMatch(/2\s*get an e-mail with their own numbers only/);
    await screenshot(page, "publish-dialog-1280");
    expect(await axe(page)).toEqual([]);
    await dialog.getByRole("button", { name: "Publish to athletes" }).click();
    await page.getByText(/athletes see every change you save here/).waitFor();
    await screenshot(page, "published-sheet-banner-1280");
    await page.close();
  });

  it("mails Tessa her own results when the session is published", async () => {
    let mails = mailsTo("athlete@example.com");
    for (let i = 0; i < 50 && mails.length === 0; i++) {
      await new Promise((r) => setTimeout(r, 200));
      mails = mailsTo("athlete@example.com");
    }
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(/^Your new results are in — Post-block testing on 2 Nov 2026$/);
    expect(mails[0].text).toContain("Hello Tessa Lindqvist");
    expect(mails[0].text).not.toContain("Priya");
  });

  it("draws a Progress line per test, keeps dates on one line, fits 390 px and passes axe-core", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signInThroughForm(page, baseUrl, "athlete@example.com");
    await page.waitForSelector("h1");
    await page.getByText("Latest change").first().waitFor();
    const cards = await page.locator("article").count();
    expect(cards).toBe(5);
    await page.waitForFunction((n) => document.querySelectorAll("figure canvas").length === n, cards);
    await page.waitForTimeout(300);
    const pixels = await drawnPixels(page);
    expect(pixels).toHaveLength(cards);
    for (const n of pixels) expect(n).toBeGreaterThan(500);
    // Dates in the score tables stay on one line.
    const heights = await page.$$eval("article table th[scope=row]", (cells) =>
      cells.map((c) => (c as HTMLElement).getBoundingClientRect().height),
    );
    expect(heights.length).toBeGreaterThan(0);
    for (const h of heights) expect(h).toBeLessThan(44);
    // A faster 30 m time reads as an improvement.
    await page.getByText(/Your 30 m sprint result (fell|rose) by/).waitFor();
    const sideways = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(sideways).toBeLessThanOrEqual(0);
    await screenshot(page, "my-progress-390");
    expect(await axe(page)).toEqual([]);

    await page.setViewportSize({ width: 1280, height: 900 });
    await page.waitForTimeout(300);
    await screenshot(page, "my-progress-1280");
    await page.close();
  });
});
