/**
 * The Reliability check of a two-trial file in the browser, as a sport scientist checks a pilot
 * retest run outside Changewise: a file with a typo is refused with its row, the corrected file
 * gives the study and its plot, and its typical error can be adopted.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";

const baseUrl = inject("baseUrl");

// An invented pilot retest of the back squat 1RM (kg), two sessions four days apart.
const PILOT = [
  ["Pilot 01", "92.5", "95.0"],
  ["Pilot 02", "80.0", "80.0"],
  ["Pilot 03", "105.0", "102.5"],
  ["Pilot 04", "70.0", "72.5"],
  ["Pilot 05", "117.5", "117.5"],
  ["Pilot 06", "85.0", "87.5"],
  ["Pilot 07", "97.5", "95.0"],
  ["Pilot 08", "62.5", "65.0"],
];
const file = (rows: string[][]) => ({
  name: "squat-pilot.csv",
  mimeType: "text/csv",
  buffer: Buffer.from(["athlete;first;second", ...rows.map((r) => r.join(";"))].join("\n")),
});

describe("Reliability check of a two-trial file", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("refuses a typo by row, checks the corrected file and adopts its typical error", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await page.goto(`${baseUrl}/reports/reliability/file`);
    await page.getByLabel("Test the scores are from").selectOption({ label: "Back squat 1RM (kg)" });

    const typo = PILOT.map((r) => [...r]);
    typo[3][2] = "72.5kg";
    await page.getByLabel("Open a CSV file").setInputFiles(file(typo));
    await expect.poll(() => page.getByLabel("Scores", { exact: true }).inputValue()).toContain("72.5kg");
    await page.getByRole("button", { name: "Check these scores" }).click();
    await page.getByRole("heading", { name: "These scores cannot be checked" }).waitFor();
    await page.getByText(/Row 5, second: .*72\.5kg/).waitFor();
    await screenshot(page, "reliability-file-refused");

    await page.getByLabel("Open a CSV file").setInputFiles(file(PILOT));
    await page.getByRole("button", { name: "Check these scores" }).click();
    await page.getByRole("heading", { name: "Test–retest result" }).waitFor();
    // TE = SD of the differences / √2, by hand: differences 2.5, 0, −2.5, 2.5, 0, 2.5, −2.5, 2.5
    // have mean 0.625 and SD 2.2160 (Python's statistics.stdev), so TE = 1.567 kg, shown as "1.57 kg".
    await page.getByText(/^1\.57 kg \(/).waitFor();
    await expect.poll(() => page.locator("canvas").count()).toBeGreaterThan(0);
    await page.getByRole("cell", { name: "95.0" }).first().waitFor();
    await screenshot(page, "reliability-file");

    await page.getByRole("button", { name: "Adopt this typical error" }).click();
    await page.getByText(/Adopted: Back squat 1RM now has a typical error of 1\.57 kg on 7 df/).waitFor();
    await page
      .getByText(/Measured: file “squat-pilot\.csv”/)
      .first()
      .waitFor();
    await page.close();
  });
});
