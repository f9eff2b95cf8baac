/**
 * The Reliability check in the browser, as a sport scientist uses it on the demo's test–retest
 * pair: the study's figures and plot, adopting its typical error, and the Change report then
 * giving each athlete an interval and a verdict.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";

const baseUrl = inject("baseUrl");

describe("Reliability check", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("adopts the measured typical error, after which the Change report shows per-athlete intervals", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    // The demo's own test–retest pair (the earliest baseline and retest of Senior Women): other
    // browser tests add later sessions, so "the latest pair" may not be it by the time this runs.
    type Listed = { id: number; squadName: string; phase: string };
    const { sessions } = (await (await page.request.get(`${baseUrl}/api/sessions`)).json()) as { sessions: Listed[] };
    const day = (phase: string) =>
      sessions.filter((x) => x.squadName === "Senior Women" && x.phase === phase).at(-1)!.id;
    const { tests } = (await (await page.request.get(`${baseUrl}/api/tests`)).json()) as {
      tests: { id: number; name: string }[];
    };
    const cmj = tests.find((t) => t.name === "Countermovement jump")!.id;
    await page.getByRole("link", { name: "Reliability check" }).waitFor();
    await page.goto(
      `${baseUrl}/reports/reliability?testId=${cmj}&firstSessionId=${day("baseline")}&secondSessionId=${day("retest")}&confidence=0.95`,
    );
    await page.getByRole("heading", { name: "Test–retest result" }).waitFor();
    await page.getByText("Typical error", { exact: true }).first().waitFor();
    await expect.poll(() => page.locator("canvas").count()).toBeGreaterThan(0);
    await screenshot(page, "reliability-check");

    await page.getByRole("button", { name: "Adopt this typical error" }).click();
    await page.getByText(/Adopted: Countermovement jump now has a typical error of/).waitFor();

    // The Change report of the same squad now reads each athlete's change against that noise.
    await page.goto(`${baseUrl}/reports/change`);
    await page.getByRole("heading", { name: "Squad result" }).waitFor();
    await page.getByLabel("Squad", { exact: true }).selectOption({ label: "Senior Women" });
    await page.getByLabel("Test", { exact: true }).selectOption({ label: "Countermovement jump" });
    await page.getByRole("columnheader", { name: "Interval (typical error)" }).waitFor();
    expect(await page.getByText("has no typical error yet").count()).toBe(0);
    await screenshot(page, "change-report-with-te");
    await page.close();
  });
});
