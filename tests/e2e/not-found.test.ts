/** A not-found page offers a way back the viewer can open: an athlete is never sent to a staff screen. */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, signInThroughForm } from "../helpers/browser";

const baseUrl = inject("baseUrl");

describe("not-found pages", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("send an athlete back to My progress and staff back to the list", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "athlete@example.com");
    for (const path of ["/sessions/999999", "/athletes/999999", "/squads/999999"]) {
      await page.goto(`${baseUrl}${path}`);
      await page.getByRole("heading", { name: /not found/ }).waitFor();
      const back = page.getByRole("link", { name: "Back to My progress" });
      expect(await back.getAttribute("href"), path).toBe("/");
    }
    await page.close();

    const staff = await browser.context.newPage();
    await signInThroughForm(staff, baseUrl, "coach@example.com");
    await staff.goto(`${baseUrl}/sessions/999999`);
    await staff.getByRole("heading", { name: /not found/ }).waitFor();
    expect(await staff.getByRole("link", { name: "Back to My progress" }).count()).toBe(0);
    await staff.close();
  });
});
