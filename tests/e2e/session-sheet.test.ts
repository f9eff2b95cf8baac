import type { Page, Request } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Row = {
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  flag: string | null;
  version: number;
  updatedByName: string | null;
};
type Sheet = {
  session: { id: number };
  tests: { id: number; name: string }[];
  athletes: { id: number; name: string }[];
  results: Row[];
};

const CMJ = "Countermovement jump";
const SPRINT = "10 m sprint";
const trial = (page: Page, athlete: string, test: string, n: number) =>
  page.getByLabel(`${athlete}, ${test}, trial ${n}`, { exact: true });

async function readSheet(http: HttpSession, sessionId: number) {
  const { status, json } = await http.json(`/api/sessions/${sessionId}`);
  expect(status).toBe(200);
  const sheet = json as Sheet;
  const find = (athlete: string, test: string) => {
    const a = sheet.athletes.find((x) => x.name === athlete)!;
    const t = sheet.tests.find((x) => x.name === test)!;
    return { athleteId: a.id, testId: t.id, row: sheet.results.find((r) => r.athleteId === a.id && r.testId === t.id) };
  };
  return { sheet, find };
}

describe("Session sheet in the browser (coach, Academy U18 post-block)", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;
  const scientist = new HttpSession(baseUrl);
  const coachHttp = new HttpSession(baseUrl);
  let sessionId = 0;

  beforeAll(async () => {
    expect((await scientist.signIn("scientist@example.com")).signedIn).toBe(true);
    expect((await coachHttp.signIn("coach@example.com")).signedIn).toBe(true);
    const { json } = await coachHttp.json("/api/sessions");
    const target = (json.sessions as { id: number; squadName: string; date: string }[]).find(
      (s) => s.squadName === "Academy U18" && s.date === "2026-11-09",
    );
    expect(target).toBeDefined();
    sessionId = target!.id;
    browser = await openBrowser();
    page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");
  });
  afterAll(async () => browser?.close());

  it("opens the session from Sessions and types scores with the keyboard; they survive a reload", async () => {
    await page.goto(`${baseUrl}/sessions`);
    await page.getByRole("link", { name: "9 Nov 2026" }).click();
    await page.waitForURL(`**/sessions/${sessionId}`);
    await page.getByRole("heading", { name: "Session sheet" }).waitFor();

    // Luca Dempsey missed the post-block day in the demo, so his row is empty.
    await trial(page, "Luca Dempsey", CMJ, 1).click();
    await page.keyboard.type("41,2"); // decimal comma
    await page.keyboard.press("Tab");
    await page.keyboard.type("40.8");
    await page.keyboard.press("Tab");
    await page.keyboard.type("41.5");
    await page.keyboard.press("Enter");
    // Enter goes down to where the run of Tabs began: the next athlete's first trial.
    expect(await page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).toBe(
      `Mateo Rusk, ${CMJ}, trial 1`,
    );
    await page.keyboard.type("39.9");
    await page.keyboard.press("Enter");
    expect(await page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).toBe(
      `Oskar Nwosu, ${CMJ}, trial 1`,
    );

    await page.getByRole("status", { name: `Saved Luca Dempsey, ${CMJ}` }).waitFor();
    await page.getByRole("status", { name: `Saved Mateo Rusk, ${CMJ}` }).waitFor();
    // The reduced score reads, to a screen reader, with the athlete, the test and the rule before it.
    const best = page.getByText(`Luca Dempsey, ${CMJ}, best:`).locator("xpath=..");
    expect(await best.textContent()).toBe(`Luca Dempsey, ${CMJ}, best: 41.5`);
    await screenshot(page, "session-sheet");

    await page.reload();
    await trial(page, "Luca Dempsey", CMJ, 1).waitFor();
    expect(await trial(page, "Luca Dempsey", CMJ, 1).inputValue()).toBe("41.2");
    expect(await trial(page, "Luca Dempsey", CMJ, 2).inputValue()).toBe("40.8");
    expect(await trial(page, "Luca Dempsey", CMJ, 3).inputValue()).toBe("41.5");
    expect(await trial(page, "Mateo Rusk", CMJ, 1).inputValue()).toBe("39.9");

    const { find } = await readSheet(coachHttp, sessionId);
    expect(find("Luca Dempsey", CMJ).row?.trials).toEqual([41.2, 40.8, 41.5]);
  });

  it("refuses text that is not a number, on the cell, and sends nothing", async () => {
    const writes: Request[] = [];
    const watch = (request: Request) => {
      if (request.method() === "PUT" && request.url().includes("/results")) writes.push(request);
    };
    page.on("request", watch);
    await trial(page, "Luca Dempsey", SPRINT, 1).click();
    await page.keyboard.type("abc");
    await page.keyboard.press("Tab");
    await page.getByRole("alert").filter({ hasText: "“abc” is not a number. Not saved." }).waitFor();
    expect(await trial(page, "Luca Dempsey", SPRINT, 1).getAttribute("aria-invalid")).toBe("true");
    await page.waitForTimeout(400);
    page.off("request", watch);
    expect(writes).toHaveLength(0);
    const { find } = await readSheet(coachHttp, sessionId);
    expect(find("Luca Dempsey", SPRINT).row).toBeUndefined();
    await screenshot(page, "session-sheet-refused");

    // Typing a real number over it clears the refusal and saves.
    await trial(page, "Luca Dempsey", SPRINT, 1).click();
    await page.keyboard.type("1.91");
    await page.keyboard.press("Tab");
    await page.getByRole("status", { name: `Saved Luca Dempsey, ${SPRINT}` }).waitFor();
    expect(await trial(page, "Luca Dempsey", SPRINT, 1).getAttribute("aria-invalid")).toBeNull();
  });

  it("a stale write shows who changed the result and lets the coach overwrite, then undo", async () => {
    // The scientist changes Mateo Rusk's jump behind the coach's back.
    const { find } = await readSheet(scientist, sessionId);
    const mateo = find("Mateo Rusk", CMJ);
    const put = await scientist.json(`/api/sessions/${sessionId}/results`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        results: [
          {
            athleteId: mateo.athleteId,
            testId: mateo.testId,
            trials: [38.0, 38.5, 38.1],
            flag: null,
            note: null,
            version: mateo.row!.version,
          },
        ],
      }),
    });
    expect(put.status).toBe(200);

    // The coach's page still holds the old version.
    await trial(page, "Mateo Rusk", CMJ, 2).click();
    await page.keyboard.type("40");
    await page.keyboard.press("Tab");
    const issue = page.getByRole("alert").filter({ hasText: "Dr Tomás Everly changed this at" });
    await issue.waitFor();
    expect(await issue.textContent()).toContain("now 38.0, 38.5, 38.1");
    await screenshot(page, "session-sheet-conflict");

    await issue.getByRole("button", { name: "Overwrite with mine" }).click();
    await page.getByRole("status", { name: `Saved Mateo Rusk, ${CMJ}` }).waitFor();
    const after = (await readSheet(coachHttp, sessionId)).find("Mateo Rusk", CMJ).row!;
    // "Mine" is the whole result as the coach saw and edited it, not a merge with theirs.
    expect(after.trials).toEqual([39.9, 40, mateo.row!.trials[2]]);
    expect(after.updatedByName).toBe("Gus Adebayo");

    // Recent changes lists both people; undo puts the scientist's value back.
    const changes = page.getByRole("region", { name: "Recent changes" });
    await changes.getByText("Dr Tomás Everly changed Mateo Rusk").first().waitFor();
    await page.getByRole("button", { name: "Undo last change" }).click();
    await page.getByText(`Undid the last change: Mateo Rusk · ${CMJ}.`).waitFor();
    await expect.poll(() => trial(page, "Mateo Rusk", CMJ, 2).inputValue()).toBe("38.5");
    await screenshot(page, "session-sheet-after-undo");
  });

  it("pastes a block from a spreadsheet, starting at the focused cell", async () => {
    await trial(page, "Luca Dempsey", SPRINT, 1).click();
    await page.evaluate(() => {
      const data = new DataTransfer();
      data.setData("text/plain", "1.90\t1,88\t1.93\n1.95\t1.97\t1.94\n");
      document.activeElement?.dispatchEvent(
        new ClipboardEvent("paste", { clipboardData: data, bubbles: true, cancelable: true }),
      );
    });
    await page.getByText("Pasted 6 values.").waitFor();
    await page.getByRole("status", { name: `Saved Luca Dempsey, ${SPRINT}` }).waitFor();
    await page.getByRole("status", { name: `Saved Mateo Rusk, ${SPRINT}` }).waitFor();
    const { find } = await readSheet(coachHttp, sessionId);
    expect(find("Luca Dempsey", SPRINT).row?.trials).toEqual([1.9, 1.88, 1.93]);
    expect(find("Mateo Rusk", SPRINT).row?.trials).toEqual([1.95, 1.97, 1.94]);
  });

  it("'Use theirs' takes the other person's value; a flag saves from its select", async () => {
    const { find } = await readSheet(scientist, sessionId);
    const luca = find("Luca Dempsey", CMJ);
    const put = await scientist.json(`/api/sessions/${sessionId}/results`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        results: [
          {
            athleteId: luca.athleteId,
            testId: luca.testId,
            trials: [42.0, 40.8, 41.5],
            flag: null,
            note: null,
            version: luca.row!.version,
          },
        ],
      }),
    });
    expect(put.status).toBe(200);
    await trial(page, "Luca Dempsey", CMJ, 3).click();
    await page.keyboard.type("43.3");
    await page.keyboard.press("Tab");
    const issue = page.getByRole("alert").filter({ hasText: "Dr Tomás Everly changed this at" });
    await issue.waitFor();
    await issue.getByRole("button", { name: "Use theirs" }).click();
    await expect.poll(() => trial(page, "Luca Dempsey", CMJ, 1).inputValue()).toBe("42.0");
    expect(await trial(page, "Luca Dempsey", CMJ, 3).inputValue()).toBe("41.5");
    expect((await readSheet(coachHttp, sessionId)).find("Luca Dempsey", CMJ).row!.trials).toEqual([42, 40.8, 41.5]);

    await page.getByLabel(`Oskar Nwosu, Back squat 1RM, flag`).selectOption("injured");
    await page.getByRole("status", { name: "Saved Oskar Nwosu, Back squat 1RM" }).waitFor();
    expect((await readSheet(coachHttp, sessionId)).find("Oskar Nwosu", "Back squat 1RM").row!.flag).toBe("injured");
  });
});

describe("other Capture screens render for the owner", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => browser?.close());

  it("Test library, Roster and Sessions", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "owner@example.com");
    await page.goto(`${baseUrl}/tests`);
    await page.getByText("Countermovement jump", { exact: true }).waitFor();
    expect(await page.getByText("0.2 × between-athlete SD").count()).toBeGreaterThan(0);
    await screenshot(page, "test-library");

    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Squads" }).click();
    await page.getByRole("link", { name: "Academy U18", exact: true }).click();
    await page.getByRole("cell", { name: "Jonah Pellegrini", exact: true }).waitFor();
    await page.getByLabel("Filter athletes").fill("mateo");
    expect(await page.locator("tbody tr").count()).toBe(1);
    await page.getByLabel("Filter athletes").fill("");
    await page.getByRole("button", { name: /Date of birth/ }).click();
    expect(await page.locator("tbody tr").first().textContent()).toContain("Jonah Pellegrini"); // born 1 Jan 2008
    await page.getByRole("button", { name: /Date of birth/ }).click();
    expect(await page.locator("tbody tr").first().textContent()).toContain("Finn Castell"); // born 24 Dec 2011
    await page.getByRole("button", { name: /^Name/ }).click();
    await screenshot(page, "roster");

    // Add an athlete, then move them to the other squad.
    await page.getByRole("button", { name: "Add athlete" }).click();
    const add = page.getByRole("dialog", { name: /Add an athlete/ });
    await add.getByLabel("Name", { exact: true }).fill("Ines Calloway");
    await add.getByLabel("Position or event").fill("MF");
    await add.getByLabel("Date of birth").fill("2009-05-17");
    await add.getByLabel("Sex").selectOption("female");
    await add.getByRole("button", { name: "Add athlete" }).click();
    await page.getByText("Ines Calloway was added.").waitFor();
    await page.getByRole("button", { name: "Move Ines Calloway" }).click();
    const move = page.getByRole("dialog", { name: "Move Ines Calloway" });
    await move.getByLabel("Squad", { exact: true }).selectOption({ label: "Senior Women" });
    await screenshot(page, "roster-move");
    await move.getByRole("button", { name: "Move" }).click();
    await page.getByText("Ines Calloway was moved to Senior Women.").waitFor();
    await expect.poll(() => page.getByRole("cell", { name: "Ines Calloway", exact: true }).count()).toBe(0);

    await page.getByRole("button", { name: "Squad settings" }).click();
    const settings = page.getByRole("dialog", { name: "Squad settings" });
    await settings.getByRole("checkbox", { name: /Gus Adebayo/ }).waitFor();
    expect(await settings.getByRole("checkbox", { name: /Gus Adebayo/ }).isChecked()).toBe(true);
    await screenshot(page, "squad-settings");
    await settings.getByRole("button", { name: "Close" }).click();

    await page.getByRole("link", { name: "Sessions", exact: true }).first().click();
    await page.getByRole("heading", { name: "Sessions" }).waitFor();
    await page.getByRole("cell", { name: "Academy U18" }).first().waitFor();
    await screenshot(page, "sessions");
    await page.close();
  });

  it("the owner adds a test (server errors land on the field) and creates a session through the form", async () => {
    const page = await browser.context.newPage();
    await page.goto(`${baseUrl}/tests`);
    await page.getByRole("button", { name: "New test" }).click();
    const dialog = page.getByRole("dialog", { name: "New test" });
    await dialog.getByRole("button", { name: "Add test" }).click();
    await dialog.getByText("Name is required.").waitFor();
    await dialog.getByText("Choose whether higher or lower is better.").waitFor();
    await screenshot(page, "test-form-errors");

    await dialog.getByLabel("Name", { exact: true }).fill("Countermovement jump");
    await dialog.getByLabel("Unit", { exact: true }).fill("cm");
    await dialog.getByLabel(/Higher is better/).check();
    await dialog.getByRole("button", { name: "Add test" }).click();
    await dialog
      .getByText(/already exists/)
      .first()
      .waitFor();
    expect(await dialog.getByLabel("Name", { exact: true }).getAttribute("aria-invalid")).toBe("true");

    await dialog.getByLabel("Name", { exact: true }).fill("Standing broad jump");
    await dialog.getByLabel("Typical error (cm)").fill("4,1");
    await dialog.getByLabel("Its df").fill("19");
    await dialog.getByRole("button", { name: "Add test" }).click();
    await page.getByText("Standing broad jump was added to the Test library.").waitFor();
    // The Test library shows a row's figures twice, in its cells and (below sm, hidden here) stacked under its name.
    await page.getByText("4.1 cm (df 19)").filter({ visible: true }).waitFor();

    await page.goto(`${baseUrl}/sessions`);
    await page.getByRole("button", { name: "New session" }).click();
    const form = page.getByRole("dialog", { name: "New session" });
    await form.getByLabel("Squad", { exact: true }).selectOption({ label: "Academy U18" });
    await form.getByLabel("Date").fill("2026-12-01");
    await form.getByLabel("Phase").selectOption({ label: "Retest" });
    await form.getByRole("checkbox", { name: /Standing broad jump/ }).check();
    await form.getByRole("checkbox", { name: /10 m sprint/ }).check();
    await screenshot(page, "session-form");
    await form.getByRole("button", { name: "Create session" }).click();
    await page.waitForURL(/\/sessions\/\d+$/);
    await page.getByRole("heading", { name: "Session sheet" }).waitFor();
    await page.getByRole("columnheader", { name: /Standing broad jump/ }).waitFor();
    expect(await page.getByText("0 of 24 results").count()).toBe(1);
    await page.getByRole("button", { name: "Publish…" }).click();
    await page
      .getByRole("dialog", { name: "Publish this session?" })
      .getByText(/will see their own results/)
      .waitFor();
    await screenshot(page, "publish-confirm");
    await page.getByRole("button", { name: "Cancel" }).click();
    await page.close();
  });

  it("a coach sees a published session read only, and the sheet fits a tablet", async () => {
    const page = await browser.context.newPage();
    await browser.context.clearCookies();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.goto(`${baseUrl}/sessions`);
    await page.getByRole("link", { name: "14 Sept 2026" }).click();
    await page.getByText(/Read only/).waitFor();
    expect(await page.getByRole("textbox").count()).toBe(0);
    expect(await page.getByRole("button", { name: "Undo last change" }).count()).toBe(0);

    await page.setViewportSize({ width: 820, height: 1180 });
    await page.goto(`${baseUrl}/sessions`);
    await page.getByRole("link", { name: "9 Nov 2026" }).click();
    await page.getByRole("heading", { name: "Session sheet" }).waitFor();
    await page.getByLabel("Show").selectOption({ label: CMJ });
    await trial(page, "Callum Adeyemi", CMJ, 1).waitFor();
    await screenshot(page, "session-sheet-tablet");
    await page.close();
  });

  it("a coach does not reach another coach's squad or session", async () => {
    const page = await browser.context.newPage();
    await browser.context.clearCookies();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    const owner = new HttpSession(baseUrl);
    await owner.signIn("owner@example.com");
    const { json } = await owner.json("/api/squads");
    const senior = (json.squads as { id: number; name: string }[]).find((s) => s.name === "Senior Women")!;
    await page.goto(`${baseUrl}/squads/${senior.id}`);
    await page.getByRole("heading", { name: "Squad not found" }).waitFor();
    await page.close();
  });
});
