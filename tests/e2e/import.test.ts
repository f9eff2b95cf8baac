import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

describe("Import over HTTP against the production build", () => {
  it("refuses a file over 10 MB with 413 and a binary file with 415, as JSON", async () => {
    const http = new HttpSession(baseUrl);
    await http.signIn("scientist@example.com");
    const { json } = await http.json("/api/sessions");
    const session = json.sessions.find((s: any) => s.squadName === "Senior Women" && s.phase === "post-block");
    const send = async (bytes: Uint8Array, name: string) => {
      const form = new FormData();
      form.set("file", new File([bytes as BlobPart], name, { type: "text/csv" }));
      const response = await http.fetch(`/api/sessions/${session.id}/import?mode=preview`, {
        method: "POST",
        body: form,
      });
      return { status: response.status, json: await response.json() };
    };
    const big = await send(new Uint8Array(10 * 1024 * 1024 + 10).fill(0x31), "big.csv");
    expect(big.status).toBe(413);
    expect(big.json.error.message).toMatch(/larger than 10 MB/);
    const binary = await send(new Uint8Array([0x50, 0x4b, 3, 4, 0, 0, 0, 0]), "book.xlsx");
    expect(binary.status).toBe(415);
    const fine = await send(
      new TextEncoder().encode("athlete,test,trial,value\nNHW001,Countermovement jump,1,33.3\n"),
      "ok.csv",
    );
    expect(fine.status).toBe(200);
    expect(fine.json).toMatchObject({ mode: "preview", format: "long", canCommit: true });
  });
});

describe("Import in the browser", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  // A session of its own, so the Session sheet tests (same server, same database) find theirs untouched.
  const session = { id: 0 };
  beforeAll(async () => {
    const coach = new HttpSession(baseUrl);
    await coach.signIn("coach@example.com");
    const squads = (await coach.json("/api/squads")).json.squads;
    const tests = (await coach.json("/api/tests")).json.tests;
    const testIds = ["Countermovement jump", "10 m sprint"].map((name) => tests.find((t: any) => t.name === name).id);
    const created = await coach.json("/api/sessions", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        squadId: squads.find((s: any) => s.name === "Academy U18").id,
        date: "2026-11-23",
        phase: "retest",
        testIds,
      }),
    });
    expect(created.status).toBe(201);
    session.id = created.json.session.id;
    browser = await openBrowser();
  });
  afterAll(async () => browser?.close());

  it("a coach previews a file with problems, then imports a good one", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");

    await page.goto(`${baseUrl}/sessions/${session.id}/import`);
    await page.getByRole("heading", { name: "Import", exact: true }).waitFor();

    const bad = [
      "athlete,test,trial,value",
      "NHA008,Countermovement jump,1,39.4",
      "NHA008,Countermovement jump,2,forty",
      "Zed Unknown,Countermovement jump,1,38.0",
      "NHA008,Broad jump,1,2.41",
      "NHA008,10 m sprint,1,1.84",
      "NHA008,10 m sprint,1,1.83",
    ].join("\n");
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: "gates-export.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("heading", { name: /problems to fix before importing/ }).waitFor();
    expect(await page.getByRole("button", { name: /^Import \d+ results?$/ }).isDisabled()).toBe(true);
    await expect.poll(() => page.getByRole("cell", { name: /No athlete “Zed Unknown”/ }).count()).toBeGreaterThan(0);
    await screenshot(page, "import-preview-errors");

    const good =
      "\uFEFFathlete;Countermovement jump 1;Countermovement jump #2;10 m sprint (trial 1);Position\r\nNHA008;39,4;40,1;1,84;MF\r\n";
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: "sheet.csv", mimeType: "text/csv", buffer: Buffer.from(good) });
    const importButton = page.getByRole("button", { name: "Import 2 results" });
    await importButton.waitFor();
    expect(await importButton.isEnabled()).toBe(true);
    await screenshot(page, "import-preview-good");
    await importButton.click();
    await page.getByRole("heading", { name: "2 results stored" }).waitFor();
    await screenshot(page, "import-done");
    await page.getByRole("link", { name: "Back to the Session sheet" }).click();
    await page.waitForURL(`${baseUrl}/sessions/${session.id}`);
    await page.close();
  });

  it("a file with “CMJ” and a misspelt name imports after two clicks, and the spelling is remembered", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.goto(`${baseUrl}/sessions/${session.id}/import`);
    const file = {
      name: "catch-up.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(
        "athlete,test,trial,value\nTheo Vargaa,CMJ,1,30.1\nTheo Vargaa,CMJ,2,30.6\nTheo Vargaa,10 m sprint,1,1.86\n",
      ),
    };
    await page.locator('input[type="file"]').setInputFiles(file);
    await page.getByRole("heading", { name: "Names in the file" }).waitFor();
    // CMJ is another name of the countermovement jump in the demo's Test library: only the name is asked about.
    expect(await page.getByText("Tests not in this session's battery").count()).toBe(0);
    await page.getByRole("button", { name: "Use Theo Varga" }).click();
    await page.getByText("Theo Vargaa reads as Theo Varga").waitFor();
    const importButton = page.getByRole("button", { name: "Import 2 results" });
    await expect.poll(() => importButton.isEnabled()).toBe(true);
    await screenshot(page, "import-names-matched");
    await importButton.click();
    await page.getByText("Remembered for the next file").waitFor();
    await screenshot(page, "import-names-done");

    // The next file that spells him so is read without asking.
    await page.getByRole("button", { name: "Import another file" }).click();
    await page.locator('input[type="file"]').setInputFiles(file);
    await page.getByText("0 new · 0 updated · 2 already stored").waitFor();
    expect(await page.getByRole("heading", { name: "Names in the file" }).count()).toBe(0);
    await page.close();
  });

  it("leaves out the rows of a guest and of a test outside the battery, as asked, and says so", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.goto(`${baseUrl}/sessions/${session.id}/import`);
    const text = [
      "athlete,test,trial,value",
      "Sami Okonkwo,10 m sprint,2,1.83",
      "Guest Runner,10 m sprint,1,1.97",
      "Sami Okonkwo,30 m sprint,1,4.41",
    ].join("\n");
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: "gates.csv", mimeType: "text/csv", buffer: Buffer.from(text) });
    await page.getByRole("heading", { name: "Names in the file" }).waitFor();
    await page.getByRole("button", { name: "Leave out these rows" }).first().click();
    await page.getByText("Guest Runner: 1 row not imported").waitFor();
    await page.getByRole("button", { name: "Leave out these rows" }).click();
    await page.getByText("30 m sprint: 1 row not imported").waitFor();
    const importButton = page.getByRole("button", { name: "Import 1 result" });
    await expect.poll(() => importButton.isEnabled()).toBe(true);
    await screenshot(page, "import-left-out");
    await importButton.click();
    await page.getByText("Left out as asked: Guest Runner (1 row); 30 m sprint (1 row).").waitFor();
    await page.close();
  });

  it("a wide file's misspelt test, matched once, reads in every one of its columns", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.goto(`${baseUrl}/sessions/${session.id}/import`);
    const text =
      "Athlete,CMJ 1,CMJ 2,Sprnt 10 m 1,Sprnt 10 m 2\nRafael Strand,38.2,38.9,1.79,1.77\nMateo Rusk,31.0,31.4,1.84,1.83\n";
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: "wide.csv", mimeType: "text/csv", buffer: Buffer.from(text) });
    await page.getByRole("button", { name: "Use 10 m sprint" }).click();
    await page.getByText("Sprnt 10 m reads as 10 m sprint").waitFor();
    const importButton = page.getByRole("button", { name: "Import 4 results" });
    await expect.poll(() => importButton.isEnabled()).toBe(true);
    await importButton.click();
    await page.getByText(/8 scores in 2 rows/).waitFor();
    await page.close();
  });

  it("maps an unknown column in the mapping step, and replaces a stored value only when asked", async () => {
    const page = await browser.context.newPage();
    await signInThroughForm(page, baseUrl, "coach@example.com");
    await page.goto(`${baseUrl}/sessions/${session.id}/import`);
    const input = page.locator('input[type="file"]');

    await input.setInputFiles({
      name: "jumps.csv",
      mimeType: "text/csv",
      buffer: Buffer.from("athlete,CMJ a\nNHA008,41.0\n"),
    });
    await page.getByRole("heading", { name: /1 problem to fix/ }).waitFor();
    await page.getByLabel("Test for column CMJ a").selectOption({ label: "Countermovement jump (cm)" });
    await page.getByLabel("Trial for column CMJ a").selectOption("3");
    await page.getByRole("button", { name: "Check the file with this mapping" }).click();
    const one = page.getByRole("button", { name: "Import 1 result" });
    await one.waitFor();
    await expect.poll(() => one.isEnabled()).toBe(true);
    await one.click();
    await page.getByRole("heading", { name: "1 result stored", exact: true }).waitFor();

    await page.getByRole("button", { name: "Import another file" }).click();
    await input.setInputFiles({
      name: "fix.csv",
      mimeType: "text/csv",
      buffer: Buffer.from("athlete,Countermovement jump 1\nNHA008,39.9\n"),
    });
    await page.getByRole("heading", { name: "1 stored value would be replaced" }).waitFor();
    const replaceButton = page.getByRole("button", { name: "Import 1 result" });
    expect(await replaceButton.isDisabled()).toBe(true);
    await page.getByLabel(/Replace the 1 stored value/).check();
    await screenshot(page, "import-replace");
    await replaceButton.click();
    await page.getByRole("heading", { name: "1 result stored, 1 value replaced" }).waitFor();
    const sheet = await (await page.request.get(`${baseUrl}/api/sessions/${session.id}`)).json();
    const luca = sheet.athletes.find((a: any) => a.name === "Luca Dempsey");
    const cmj = sheet.tests.find((t: any) => t.name === "Countermovement jump");
    expect(sheet.results.find((r: any) => r.athleteId === luca.id && r.testId === cmj.id)).toMatchObject({
      trials: [39.9, 40.1, 41],
      value: 41,
    });
    await page.close();
  });
});
