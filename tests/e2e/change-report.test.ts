/**
 * The Change report in the browser, as a sport scientist meets it after the post-block session:
 * it opens on the latest pre/post pair, shows the squad result and every athlete, and draws
 * the three charts (each canvas has ink on it).
 */
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";

const baseUrl = inject("baseUrl");

/** Share of a canvas's pixels that are not blank. */
const inked = (page: Page, index: number) =>
  page.evaluate((i) => {
    const canvas = document.querySelectorAll("canvas")[i] as HTMLCanvasElement;
    const { data } = canvas.getContext("2d")!.getImageData(0, 0, canvas.width, canvas.height);
    let painted = 0;
    for (let p = 3; p < data.length; p += 4) if (data[p] > 0) painted++;
    return painted / (data.length / 4);
  }, index);

describe("Change report", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("opens on the latest pre/post pair with the squad result, the athletes and three drawn charts", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await page.getByRole("link", { name: "Change report" }).click();
    await page.waitForURL(/\/reports\/change\?testId=\d+&fromSessionId=\d+&toSessionId=\d+&confidence=0.9/);
    await page.getByRole("heading", { name: "Squad result" }).waitFor();
    await expect.poll(() => page.locator("canvas").count()).toBe(3);
    for (let i = 0; i < 3; i++) await expect.poll(() => inked(page, i)).toBeGreaterThan(0.01);
    expect(await page.getByText(/90 % interval/i).count()).toBeGreaterThan(0);
    const rows = await page.locator("table tbody tr").count();
    expect(rows).toBeGreaterThan(5);
    await screenshot(page, "change-report");

    // Printed: one A4 landscape page, the cautions at its foot.
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "change-report-print");
    const pdf = await page.pdf({ format: "A4", landscape: true, printBackground: true });
    expect(pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g)?.length).toBe(1);
    await page.emulateMedia({ media: "screen" });

    // The scientist's note is saved with the report and reopens with it.
    await page.getByLabel(/Note for the coaches/).fill("Most of the squad jumped higher; check the two who did not.");
    await page.getByRole("button", { name: "Save report with note" }).click();
    await page.getByRole("link", { name: "Open the saved report" }).click();
    await page.getByText("Most of the squad jumped higher; check the two who did not.").waitFor();
    await page.getByRole("heading", { name: "Squad result" }).waitFor();
    await screenshot(page, "saved-report");
    await page.goBack();
    await page.getByRole("heading", { name: "Squad result" }).waitFor();

    // A sprint: the report says how a faster time reads, and the choice lands in the URL.
    await page.getByLabel("Test", { exact: true }).selectOption({ label: "30 m sprint" });
    await page.getByText("a faster (lower) time shows as a negative change").waitFor();
    expect(page.url()).toMatch(/testId=\d+/);
    const shared = page.url();
    await page.goto(shared);
    await page.getByRole("heading", { name: "Squad result" }).waitFor();
    expect(await page.getByLabel("Test", { exact: true }).locator("option:checked").textContent()).toBe("30 m sprint");
    await page.setViewportSize({ width: 820, height: 1100 });
    await screenshot(page, "change-report-tablet");
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await page.close();
  });

  it("is not there for athletes", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "athlete@example.com");
    const response = await page.goto(`${baseUrl}/reports/change`);
    await page.getByText("Session or test not found").waitFor();
    expect(response?.status()).toBeLessThan(500);
    await page.close();
  });
});
