/**
 * One screen, one name: Squads (the staff home) lists the squads, /squads leads there, a Roster's
 * tab names its squad. And every dialog can be left by Cancel or Escape, with focus back on the
 * control that opened it.
 */
import type { Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Squad = { id: number; name: string };

describe("Squads is the one list of squads", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let squads: Squad[];
  beforeAll(async () => {
    browser = await openBrowser();
    const owner = new HttpSession(baseUrl);
    await owner.signIn("owner@example.com");
    squads = (await owner.json("/api/squads")).json.squads;
  });
  afterAll(() => browser?.close());
  const squad = (name: string) => squads.find((s) => s.name === name)!;

  it("/squads leads to Squads", async () => {
    const coach = new HttpSession(baseUrl);
    await coach.signIn("coach@example.com");
    const answer = await coach.fetch("/squads");
    expect(answer.status).toBe(307);
    expect(new URL(answer.headers.get("location")!, baseUrl).pathname).toBe("/");
  });

  it("the main navigation names Squads once and no Roster; a Roster's tab and breadcrumb name its squad", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    const nav = page.getByRole("navigation", { name: "Main" });
    await nav.getByRole("link", { name: "Squads" }).waitFor();
    expect(await nav.getByRole("link").allTextContents()).not.toContain("Roster");
    // The title streams in after the page body (metadata is streamed), so it is polled.
    await expect.poll(() => page.title()).toBe("Squads · Changewise");
    // A coach creates no squad.
    expect(await page.getByRole("button", { name: "New squad" }).count()).toBe(0);

    await page.getByRole("link", { name: "Academy U18", exact: true }).click();
    await page.getByRole("heading", { name: "Academy U18", level: 1 }).waitFor();
    await expect.poll(() => page.title()).toBe("Roster · Academy U18 · Changewise");
    const crumb = page.getByRole("navigation", { name: "Breadcrumb" }).getByRole("link", { name: "Squads" });
    expect(await crumb.getAttribute("href")).toBe("/");

    // Another coach's squad: the same not-found as a squad that does not exist, and a way back the coach can open.
    for (const id of [squad("Senior Women").id, 999999]) {
      await page.goto(`${baseUrl}/squads/${id}`);
      await page.getByRole("heading", { name: "Squad not found" }).waitFor();
      await expect.poll(() => page.title()).toBe("Roster · Changewise");
      expect(await page.getByRole("link", { name: "Back to Squads" }).getAttribute("href")).toBe("/");
    }
    await page.close();
  });

  it("the owner finds New squad and the archived squads on Squads", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "owner@example.com");
    await page.getByRole("heading", { name: "Squads", level: 1 }).waitFor();
    await page.getByLabel("Show archived squads").check();
    await page.getByRole("link", { name: "Senior Women", exact: true }).waitFor();
    await page.getByLabel("Show archived squads").uncheck();

    const opener = page.getByRole("button", { name: "New squad" });
    await leaveByCancel(page, opener, "New squad");
    await leaveByEscape(page, opener, "New squad");
    await page.close();
  });
});

/** The dialog the opener opens has ×, closes with Cancel, and focus is back on the opener. */
async function leaveByCancel(page: Page, opener: Locator, title: string | RegExp, cancel = "Cancel") {
  await opener.click();
  const dialog = page.getByRole("dialog", { name: title });
  await dialog.waitFor();
  await dialog.getByRole("button", { name: "Close", exact: true }).waitFor();
  await dialog.getByRole("button", { name: cancel, exact: true }).click();
  await dialog.waitFor({ state: "hidden" });
  expect(await opener.evaluate((el) => el === document.activeElement), `focus back on the opener of ${title}`).toBe(
    true,
  );
}

async function leaveByEscape(page: Page, opener: Locator, title: string | RegExp) {
  await opener.click();
  const dialog = page.getByRole("dialog", { name: title });
  await dialog.waitFor();
  await page.keyboard.press("Escape");
  await dialog.waitFor({ state: "hidden" });
  expect(await opener.evaluate((el) => el === document.activeElement), `focus back after Escape in ${title}`).toBe(
    true,
  );
}

describe("every dialog can be left", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("on the Roster, the Test library and Sessions", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "owner@example.com");
    await page.getByRole("link", { name: "Academy U18", exact: true }).click();
    await page.getByRole("heading", { name: "Academy U18", level: 1 }).waitFor();

    await leaveByCancel(page, page.getByRole("button", { name: "Add athlete" }), /Add an athlete/);
    await page.getByRole("button", { name: "Add athlete" }).click();
    await page.getByRole("tab", { name: "Already in the organisation" }).click();
    await page.getByRole("dialog").getByRole("button", { name: "Cancel" }).waitFor();
    await page.keyboard.press("Escape");
    const edit = page.getByRole("button", { name: "Edit Jonah Pellegrini" });
    await leaveByCancel(page, edit, "Edit Jonah Pellegrini");
    await leaveByEscape(page, edit, "Edit Jonah Pellegrini");
    await leaveByCancel(page, page.getByRole("button", { name: "Move Jonah Pellegrini" }), "Move Jonah Pellegrini");
    await leaveByCancel(page, page.getByRole("button", { name: "Squad settings" }), "Squad settings", "Done");

    await page.goto(`${baseUrl}/tests`);
    await page.getByRole("heading", { name: "Test library", level: 1 }).waitFor();
    await leaveByCancel(page, page.getByRole("button", { name: "New test" }), "New test");
    await leaveByCancel(page, page.getByRole("button", { name: "Edit 10 m sprint" }), "Edit 10 m sprint");

    await page.goto(`${baseUrl}/sessions`);
    await page.getByRole("heading", { name: "Sessions", level: 1 }).waitFor();
    await leaveByCancel(page, page.getByRole("button", { name: "New session" }), "New session");
    await leaveByEscape(page, page.getByRole("button", { name: "Publish…" }).first(), "Publish this session?");
    await screenshot(page, "dialogs-left-sessions");
    await page.close();
  });

  it("on a phone, the row's own buttons open the dialogs", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signInThroughForm(page, baseUrl, "owner@example.com");
    await page.getByRole("link", { name: "Academy U18", exact: true }).click();
    await page.getByRole("heading", { name: "Academy U18", level: 1 }).waitFor();
    await leaveByCancel(page, page.getByRole("button", { name: "Edit Jonah Pellegrini" }), "Edit Jonah Pellegrini");
    await screenshot(page, "roster-390-after-dialog");
    await page.close();
  });
});
