/**
 * The typo guard on the Session sheet, as a coach meets it on a tablet: 17.60 typed for a
 * 10 m sprint is saved, marked, explained beside the row in words (not only a tooltip),
 * counted at the top and read out by the live region.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("typo guard on the Session sheet", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("explains a mistyped sprint time beside the row and counts it at the top", async () => {
    const http = new HttpSession(baseUrl);
    await http.signIn("scientist@example.com");
    const squads = (await http.json("/api/squads")).json.squads as { id: number; name: string }[];
    const tests = (await http.json("/api/tests")).json.tests as { id: number; name: string }[];
    const senior = squads.find((s) => s.name === "Senior Women")!.id;
    const sprint = tests.find((t) => t.name === "10 m sprint")!.id;
    // Dated early, so no other browser test takes it for the squad's latest session.
    const created = await http.json("/api/sessions", {
      method: "POST",
      headers: { "content-type": "application/json", origin: baseUrl },
      body: JSON.stringify({ squadId: senior, date: "2026-02-02", phase: "in-season", testIds: [sprint] }),
    });
    expect(created.status).toBe(201);
    const sessionId = created.json.session.id;

    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 820, height: 1180 });
    await signInThroughForm(page, baseUrl, "coach2@example.com");
    await page.goto(`${baseUrl}/sessions/${sessionId}`);
    const cell = page.getByLabel("Maren Oduya, 10 m sprint, trial 1", { exact: true });
    await cell.click();
    await page.keyboard.type("17.60");
    await expect.poll(() => cell.inputValue()).toBe("17.60");
    await cell.press("Tab");
    await page.getByText("1 score to double-check").waitFor();
    const note = page.locator("li", { hasText: /Double-check 10 m sprint, trial 1: 17\.60 s/ });
    await note.waitFor();
    expect(await note.textContent()).toMatch(/outside the plausible range 1\.5–2\.6 s/);
    // The live region says it too, and the cell points at the note for screen readers.
    await expect
      .poll(() => page.locator("[aria-live=polite]").first().textContent())
      .toMatch(/Double-check Maren Oduya/);
    const describedBy = await cell.getAttribute("aria-describedby");
    expect(await page.locator(`#${describedBy}`).textContent()).toMatch(/outside the plausible range/);
    await screenshot(page, "typo-guard-tablet");

    // Corrected by clicking into the cell twice and typing: the click selects the score, so the
    // new digits replace it instead of merging into it.
    await cell.click();
    await cell.click();
    await page.keyboard.type("1.76");
    expect(await cell.inputValue()).toBe("1.76");
    await cell.press("Tab");
    await expect.poll(() => page.getByText("1 score to double-check").count()).toBe(0);
    await page.close();
  });
});
