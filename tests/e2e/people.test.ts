/**
 * People in the browser, with mail through the local SMTP fake: the owner invites a coach, the
 * invitation mail lands in the outbox folder, the coach opens its link, chooses a password and
 * lands signed in; the owner reads the mail on the Outbox page. Then the new coach forgets the
 * password, asks for a link, opens the reset mail and chooses a new one, which signs them in
 * and ends the session they had.
 */
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";
import { linkIn, waitForMail } from "../helpers/outbox-files";

const baseUrl = inject("baseUrl");
const outboxDir = inject("outboxDir");
const NEWCOMER = "nadia.e2e@example.com";

type Browser = Awaited<ReturnType<typeof openBrowser>>;
let owner: Browser;
let newcomer: Browser;
let later: Browser;

beforeAll(async () => {
  [owner, newcomer, later] = await Promise.all([openBrowser(), openBrowser(), openBrowser()]);
});
afterAll(async () => {
  await Promise.all([owner?.close(), newcomer?.close(), later?.close()]);
});

const me = (page: Page) =>
  page.evaluate(async () => {
    const response = await fetch("/api/me");
    return { status: response.status, body: response.ok ? await response.json() : null };
  });

describe("people through the mail", () => {
  let newcomerPage: Page;

  it("the owner invites a coach; the coach accepts from the mail and lands signed in", async () => {
    const page = await owner.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "owner@example.com");
    await page.getByRole("link", { name: "People" }).click();
    await page.getByRole("heading", { name: "People", level: 1 }).waitFor();
    await page.getByRole("button", { name: "Invite someone" }).click();
    const dialog = page.getByRole("dialog", { name: "Invite someone" });
    await dialog.getByLabel("E-mail").fill(NEWCOMER);
    await dialog.getByRole("radio", { name: /^Coach/ }).check();
    await dialog.getByRole("button", { name: "Send the invitation" }).click();
    await page.getByText(`An invitation is on its way to ${NEWCOMER}`).waitFor();
    await page.getByRole("cell", { name: NEWCOMER, exact: true }).waitFor();
    await screenshot(page, "people-invited-1280");

    const mail = await waitForMail(outboxDir, NEWCOMER, /^Join .+ on Changewise$/);
    expect(mail.text).toContain("as a coach");
    const link = linkIn(mail, "invitations");
    expect(link.startsWith(baseUrl)).toBe(true);

    newcomerPage = await newcomer.context.newPage();
    await newcomerPage.setViewportSize({ width: 390, height: 844 });
    await newcomerPage.goto(link);
    await newcomerPage.getByRole("heading", { name: /^Join / }).waitFor();
    await screenshot(newcomerPage, "invitation-accept-390");
    await newcomerPage.getByLabel("Your name").fill("Nadia Ferreira");
    await newcomerPage.getByLabel("Choose a password").fill("first-chosen-password");
    await newcomerPage.getByLabel("Type it again").fill("first-chosen-password");
    await newcomerPage.getByRole("button", { name: "Join and sign in" }).click();
    await newcomerPage.waitForURL(`${baseUrl}/`);
    await newcomerPage.locator("h1").first().waitFor();
    await expect.poll(async () => (await me(newcomerPage)).body?.role).toBe("coach");
    expect((await me(newcomerPage)).body.user).toMatchObject({ email: NEWCOMER, name: "Nadia Ferreira" });
    await screenshot(newcomerPage, "invitation-accepted-home-390");

    // The link worked once.
    const again = await later.context.newPage();
    await again.goto(link);
    await again.getByRole("heading", { name: "This link does not work any more" }).waitFor();
    await again.close();

    // The owner sees the new member, and reads the mail on the Outbox page.
    await page.reload();
    await page.getByRole("button", { name: "Remove Nadia Ferreira" }).waitFor();
    await page.getByRole("link", { name: "Outbox" }).click();
    await page.getByRole("heading", { name: "Outbox", level: 1 }).waitFor();
    await page.getByRole("button", { name: new RegExp(`^Read “Join .+” to ${NEWCOMER}`) }).click();
    const message = page.getByRole("dialog", { name: "Message" });
    await message.getByText("as a coach", { exact: false }).waitFor();
    await screenshot(page, "outbox-message-1280");
    await page.close();
  });

  it("an athlete's deletion request reaches the owner, whose confirmation counts what would go", async () => {
    const athlete = new HttpSession(baseUrl);
    await athlete.signIn("athlete2@example.com");
    const asked = await athlete.json("/api/me/deletion-request", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ message: "I am moving abroad; please remove my results." }),
    });
    expect(asked.status).toBe(201);
    const mail = await waitForMail(outboxDir, "owner@example.com", /^Deletion request from Priya Damaschke$/);
    expect(mail.text).toContain("I am moving abroad");

    const page = await owner.context.newPage();
    await page.setViewportSize({ width: 820, height: 1000 });
    await page.goto(`${baseUrl}/people`);
    await page.getByRole("heading", { name: /^Deletion requests/ }).waitFor();
    // Other browser tests may leave requests of their own: review Priya's.
    await page
      .getByRole("listitem")
      .filter({ hasText: "Priya Damaschke" })
      .getByRole("button", { name: "Review and delete…" })
      .click();
    const dialog = page.getByRole("dialog", { name: "Delete Priya Damaschke?" });
    await dialog
      .getByText(/result/)
      .first()
      .waitFor();
    await expect.poll(() => dialog.getByText("This cannot be undone.").count()).toBe(1);
    await screenshot(page, "people-deletion-dialog-820");
    // Kept here: other browser tests sign in as this athlete.
    await dialog.getByRole("button", { name: "Cancel" }).click();
    await page.getByRole("button", { name: "Invite someone" }).click();
    const invite = page.getByRole("dialog", { name: "Invite someone" });
    await invite.getByRole("radio", { name: /^Athlete/ }).check();
    await invite.getByLabel("Athlete record", { exact: true }).waitFor();
    await screenshot(page, "people-invite-athlete-820");
    await page.close();
  });

  it("a forgotten password is reset through the mail, which ends the other session", async () => {
    expect((await me(newcomerPage)).status).toBe(200);
    const page = await later.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.getByRole("heading", { name: "Forgot your password?" }).waitFor();
    await page.getByLabel("E-mail").fill(NEWCOMER);
    await page.getByRole("button", { name: "Mail me a link" }).click();
    await page.getByText("If that address belongs to a Changewise account").waitFor();
    await screenshot(page, "password-reset-asked-390");

    const link = linkIn(await waitForMail(outboxDir, NEWCOMER, /^Reset your Changewise password$/), "reset-password");
    await page.goto(link);
    await page.getByRole("heading", { name: "Choose a new password" }).waitFor();
    await screenshot(page, "password-reset-choose-390");
    await page.getByLabel("New password").fill("second-chosen-password");
    await page.getByLabel("Type it again").fill("second-typed-differently");
    await page.getByRole("button", { name: "Save and sign in" }).click();
    await page.getByText("The two passwords differ.").waitFor();
    await page.getByLabel("Type it again").fill("second-chosen-password");
    await page.getByRole("button", { name: "Save and sign in" }).click();
    await page.waitForURL(`${baseUrl}/`);
    await expect.poll(async () => (await me(page)).body?.user?.email).toBe(NEWCOMER);
    // The session opened by accepting the invitation is over.
    expect((await me(newcomerPage)).status).toBe(401);
    await page.close();
  });
});
