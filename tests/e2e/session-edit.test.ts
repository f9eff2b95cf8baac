import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("Edit session from the Session sheet", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const http = new HttpSession(baseUrl);
  const ids = { session: 0, cmj: 0, sprint: 0, athlete: 0 };

  beforeAll(async () => {
    await http.signIn("scientist@example.com");
    const squads = (await http.json("/api/squads")).json.squads;
    const tests = (await http.json("/api/tests")).json.tests;
    ids.cmj = tests.find((t: any) => t.name === "Countermovement jump").id;
    ids.sprint = tests.find((t: any) => t.name === "10 m sprint").id;
    const post = (path: string, body: unknown, method = "POST") =>
      http.json(path, { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
    const created = await post("/api/sessions", {
      squadId: squads.find((s: any) => s.name === "Senior Women").id,
      date: "2026-11-30",
      phase: "in-season",
      testIds: [ids.cmj],
    });
    ids.session = created.json.session.id;
    const sheet = (await http.json(`/api/sessions/${ids.session}`)).json;
    ids.athlete = sheet.athletes[0].id;
    expect(
      (
        await post(
          `/api/sessions/${ids.session}/results`,
          { results: [{ athleteId: ids.athlete, testId: ids.cmj, trials: [33.1], flag: null, version: null }] },
          "PUT",
        )
      ).status,
    ).toBe(200);
    browser = await openBrowser();
  });
  afterAll(async () => browser?.close());

  it("adds a test to the battery and changes the phase; a test with scores cannot leave", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await page.goto(`${baseUrl}/sessions/${ids.session}`);
    await page.getByRole("button", { name: "Edit session" }).click();
    const dialog = page.getByRole("dialog", { name: "Edit session" });
    await dialog.waitFor();
    expect(await dialog.getByLabel(/Countermovement jump/).isDisabled()).toBe(true);
    await dialog.getByLabel(/10 m sprint/).check();
    await dialog.getByLabel("Phase").selectOption("retest");
    await screenshot(page, "session-edit");
    await dialog.getByRole("button", { name: "Save session" }).click();
    await page.getByText("The session was saved.").waitFor();
    await page
      .getByText(/Retest/)
      .first()
      .waitFor();

    const { json } = await http.json(`/api/sessions/${ids.session}`);
    expect(json.session.phase).toBe("retest");
    expect(json.tests.map((t: any) => t.id)).toEqual([ids.cmj, ids.sprint]);
    expect(json.results).toHaveLength(1);
    await page.close();
  });
});
