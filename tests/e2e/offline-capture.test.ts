/**
 * Capture that survives bad Wi-Fi: with the network off, a coach types ten scores (each shows
 * as waiting), closes the tab, comes back online, reopens the sheet — and all ten are saved.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("offline capture on the Session sheet", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("keeps ten scores typed offline through closing the tab, and sends them when back online", async () => {
    const http = new HttpSession(baseUrl);
    await http.signIn("scientist@example.com");
    const squads = (await http.json("/api/squads")).json.squads as { id: number; name: string }[];
    const tests = (await http.json("/api/tests")).json.tests as { id: number; name: string }[];
    const academy = squads.find((s) => s.name === "Academy U18")!.id;
    const cmj = tests.find((t) => t.name === "Countermovement jump")!.id;
    const created = await http.json("/api/sessions", {
      method: "POST",
      headers: { "content-type": "application/json", origin: baseUrl },
      body: JSON.stringify({ squadId: academy, date: "2026-01-19", phase: "in-season", testIds: [cmj] }),
    });
    const sessionId = created.json.session.id as number;
    const athletes = (await http.json(`/api/sessions/${sessionId}`)).json.athletes.slice(0, 10) as {
      id: number;
      name: string;
    }[];
    const scores = athletes.map((_, i) => (31 + i * 0.7).toFixed(1));

    const { context } = browser;
    const page = await context.newPage();
    await page.setViewportSize({ width: 820, height: 1180 });
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.goto(`${baseUrl}/sessions/${sessionId}`);
    await page.getByRole("heading", { name: "Session sheet" }).waitFor();

    await context.setOffline(true);
    for (const [i, athlete] of athletes.entries()) {
      const cell = page.getByLabel(`${athlete.name}, Countermovement jump, trial 1`, { exact: true });
      await cell.click();
      await page.keyboard.type(scores[i]);
      await page.keyboard.press("Enter");
    }
    await page.getByText("10 waiting to send").waitFor();
    await screenshot(page, "offline-waiting");
    await page.close();

    await context.setOffline(false);
    const again = await context.newPage();
    await again.goto(`${baseUrl}/sessions/${sessionId}`);
    await again.getByRole("heading", { name: "Session sheet" }).waitFor();
    await expect
      .poll(async () => (await http.json(`/api/sessions/${sessionId}`)).json.results.length, { timeout: 15_000 })
      .toBe(10);
    const stored = (await http.json(`/api/sessions/${sessionId}`)).json.results as {
      athleteId: number;
      trials: number[];
    }[];
    for (const [i, athlete] of athletes.entries())
      expect(stored.find((r) => r.athleteId === athlete.id)?.trials).toEqual([Number(scores[i])]);
    await expect.poll(() => again.getByText(/waiting to send/).count()).toBe(0);
    await again.close();
  });
});
