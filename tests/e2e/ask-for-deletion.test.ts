/**
 * An athlete asks for their data to be deleted from My progress, on a phone; the request reaches
 * the owner. Tessa (athlete@): the People browser test makes Priya's request.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("asking for deletion", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("sends the request with a message, and the owner's list holds it", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signInThroughForm(page, baseUrl, "athlete@example.com");
    await page.getByRole("button", { name: "Ask for my data to be deleted…" }).click();
    const dialog = page.getByRole("dialog", { name: "Ask your club to delete your data?" });
    await dialog.getByLabel(/A message for the owner/).fill("I have left the club.");
    await screenshot(page, "ask-for-deletion-390");
    await dialog.getByRole("button", { name: "Send the request" }).click();
    await page.getByText(/Your request has reached your club's owner/).waitFor();
    await page.close();

    const owner = new HttpSession(baseUrl);
    await owner.signIn("owner@example.com");
    const { json } = await owner.json("/api/deletion-requests");
    expect(JSON.stringify(json)).toContain("I have left the club.");
  });
});
