/** Deleting a draft session made by mistake, through its confirm step, as a sport scientist. */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("deleting a draft session", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("says what goes with it, can be cancelled, and then deletes it", async () => {
    const http = new HttpSession(baseUrl);
    await http.signIn("scientist@example.com");
    const squads = (await http.json("/api/squads")).json.squads as { id: number; name: string }[];
    const tests = (await http.json("/api/tests")).json.tests as { id: number; name: string }[];
    const post = (path: string, body: unknown, method = "POST") =>
      http.json(path, {
        method,
        headers: { "content-type": "application/json", origin: baseUrl },
        body: JSON.stringify(body),
      });
    const academy = squads.find((s) => s.name === "Academy U18")!.id;
    const cmj = tests.find((t) => t.name === "Countermovement jump")!.id;
    const sessionId = (
      await post("/api/sessions", { squadId: academy, date: "2026-01-05", phase: "in-season", testIds: [cmj] })
    ).json.session.id;
    const sheet = (await http.json(`/api/sessions/${sessionId}`)).json;
    const saved = await post(
      `/api/sessions/${sessionId}/results`,
      { results: [{ athleteId: sheet.athletes[0].id, testId: cmj, trials: [35.5], flag: null, version: null }] },
      "PUT",
    );
    expect(saved.status).toBe(200);

    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await page.goto(`${baseUrl}/sessions/${sessionId}`);
    await page.getByRole("button", { name: "Delete draft…" }).click();
    const dialog = page.getByRole("dialog", { name: "Delete this draft session?" });
    await dialog.getByText(/Its 1 result goes with it/).waitFor();
    await screenshot(page, "session-delete-confirm");
    await dialog.getByRole("button", { name: "Cancel" }).click();
    await expect.poll(() => dialog.isVisible()).toBe(false);
    expect((await http.json(`/api/sessions/${sessionId}`)).status).toBe(200);

    await page.getByRole("button", { name: "Delete draft…" }).click();
    await dialog.getByRole("button", { name: "Delete session and its result" }).click();
    await page.waitForURL(/\/sessions$/);
    expect((await http.json(`/api/sessions/${sessionId}`)).status).toBe(404);
    await page.close();
  });
});
