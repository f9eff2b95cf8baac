/**
 * The README's pictures: the main screens as the demo accounts meet them. `npm run screenshots`
 * takes them into docs/screenshots/ from a fresh demo club; a browser test takes the same set
 * into tests/.artifacts/ so the command never rots. Desk screens are viewport-sized rather than
 * full-page, so each PNG stays small enough to keep in the repository.
 */
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import type { Locator, Page } from "playwright-core";
import { openBrowser, signInThroughForm } from "./browser";

export const README_SCREENSHOTS = "docs/screenshots";

export type Shot = { name: string; path: string; width: number; height: number; bytes: number };

type Listed = { id: number; squadName: string; phase: string };

const DESK = { width: 1280, height: 800 };
const PHONE = { width: 390, height: 844 };

async function sessionsOf(page: Page, baseUrl: string): Promise<Listed[]> {
  const answer = await page.request.get(`${baseUrl}/api/sessions`);
  return ((await answer.json()) as { sessions: Listed[] }).sessions;
}

/** The demo's own sessions, by squad and phase (the earliest, should later ones have been added). */
const sessionOf = (sessions: Listed[], squadName: string, phase: string) => {
  const found = sessions.filter((s) => s.squadName === squadName && s.phase === phase).at(-1);
  if (!found) throw new Error(`The demo club has no ${phase} session of ${squadName}`);
  return found.id;
};

/** Lets web fonts and charts settle, so a picture never catches a half-drawn screen. */
async function settle(page: Page) {
  await page.waitForLoadState("networkidle");
  await page.evaluate(() => document.fonts.ready);
  await page.waitForTimeout(400);
}

export async function takeReadmeScreenshots(baseUrl: string, dir = README_SCREENSHOTS): Promise<Shot[]> {
  mkdirSync(dir, { recursive: true });
  const browser = await openBrowser();
  const shots: Shot[] = [];
  /** `above`: the picture runs from the top of the page down to just above this element. */
  const snap = async (page: Page, name: string, { above }: { above?: Locator } = {}) => {
    await settle(page);
    const path = join(dir, `${name}.png`);
    const width = page.viewportSize()!.width;
    // Measured once the charts have drawn: before, they have not yet taken their height.
    const end = above ? await above.evaluate((e) => e.getBoundingClientRect().top + window.scrollY) : 0;
    const png = await page.screenshot(
      end ? { path, fullPage: true, clip: { x: 0, y: 0, width, height: Math.round(end - 16) } } : { path },
    );
    // PNG header: width and height are the big-endian words at bytes 16 and 20.
    shots.push({ name, path, width: png.readUInt32BE(16), height: png.readUInt32BE(20), bytes: png.length });
  };
  try {
    const staff = await browser.context.newPage();
    await staff.setViewportSize(DESK);
    await signInThroughForm(staff, baseUrl, "scientist@example.com");
    const sessions = await sessionsOf(staff, baseUrl);

    await staff.goto(`${baseUrl}/tests`);
    await staff.getByRole("heading", { name: "Test library" }).waitFor();
    await snap(staff, "test-library");

    const seniorPost = sessionOf(sessions, "Senior Women", "post-block");
    // Tall enough to show Femi Castellane's empty row, which examples/senior-post-block-catch-up.csv fills.
    await staff.setViewportSize({ width: DESK.width, height: 900 });
    await staff.goto(`${baseUrl}/sessions/${seniorPost}`);
    await staff.locator("table tbody tr").first().waitFor();
    await snap(staff, "session-sheet");
    await staff.setViewportSize(DESK);

    // The README's timing-gate example, previewed in the new session the README has the reader create.
    const tests = (await (await staff.request.get(`${baseUrl}/api/tests`)).json()) as {
      tests: { id: number; name: string }[];
    };
    const testOf = (name: string) => tests.tests.find((t) => t.name === name)!.id;
    const squads = (await (await staff.request.get(`${baseUrl}/api/squads`)).json()) as {
      squads: { id: number; name: string }[];
    };
    const created = await staff.request.post(`${baseUrl}/api/sessions`, {
      data: {
        squadId: squads.squads.find((s) => s.name === "Academy U18")!.id,
        date: "2026-11-30",
        phase: "in-season",
        testIds: [testOf("10 m sprint"), testOf("30 m sprint")],
      },
    });
    if (created.status() !== 201) throw new Error(`Creating the in-season session answered ${created.status()}`);
    const speed = ((await created.json()) as { session: { id: number } }).session.id;
    await staff.goto(`${baseUrl}/sessions/${speed}/import`);
    await staff.locator('input[type="file"]').setInputFiles("examples/academy-speed-gates.csv");
    await staff.getByRole("button", { name: "Import 24 results" }).waitFor();
    await snap(staff, "import");

    await staff.goto(`${baseUrl}/sessions/${sessionOf(sessions, "Academy U18", "post-block")}/import`);
    await staff.locator('input[type="file"]').setInputFiles("examples/academy-post-block-catch-up-misspelt.csv");
    await staff.getByRole("heading", { name: /problems to fix before importing/ }).waitFor();
    await snap(staff, "import-problems", { above: staff.getByText(/^The first \d+ of \d+ rows as written/) });

    // A test with a typical error, so every athlete has an interval and a verdict; the picture ends
    // where the table of athletes begins, with the squad result and both charts in it.
    const seniorPre = sessionOf(sessions, "Senior Women", "pre-block");
    await staff.goto(
      `${baseUrl}/reports/change?testId=${testOf("30 m sprint")}&fromSessionId=${seniorPre}&toSessionId=${seniorPost}&confidence=0.9`,
    );
    await staff.getByRole("heading", { name: "Squad result" }).waitFor();
    await staff.locator("canvas").nth(2).waitFor();
    await snap(staff, "change-report", { above: staff.getByRole("heading", { name: "Athletes", exact: true }) });

    const cmj = testOf("Countermovement jump");
    const first = sessionOf(sessions, "Senior Women", "baseline");
    const second = sessionOf(sessions, "Senior Women", "retest");
    await staff.goto(
      `${baseUrl}/reports/reliability?testId=${cmj}&firstSessionId=${first}&secondSessionId=${second}&confidence=0.95`,
    );
    await staff.getByRole("heading", { name: "Test–retest result" }).waitFor();
    await snap(staff, "reliability-check");

    // The season's last step, so the athlete's page shows the block from both ends.
    await staff.goto(`${baseUrl}/sessions/${seniorPost}`);
    await staff.getByRole("button", { name: "Publish…" }).click();
    await staff.getByRole("button", { name: "Publish to athletes" }).click();
    await staff.getByRole("button", { name: "Back to draft…" }).waitFor();
    await staff.close();

    const athlete = await browser.context.newPage();
    await athlete.setViewportSize(PHONE);
    await signInThroughForm(athlete, baseUrl, "athlete@example.com");
    await athlete.locator("h1").waitFor();
    // The first two tests (the 30 m sprint has a typical error, so its change has an interval and a
    // verdict); the whole page, one card per test, is several phone screens long.
    await athlete.locator("article canvas").nth(1).waitFor();
    await snap(athlete, "my-progress-phone", { above: athlete.locator("article").nth(2) });
    await athlete.close();
  } finally {
    await browser.close();
  }
  return shots;
}
