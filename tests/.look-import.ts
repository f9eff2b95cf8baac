import { openBrowser, signInThroughForm } from "./helpers/browser";
import { startProductionServer } from "./helpers/server";

const server = await startProductionServer();
const { context, close } = await openBrowser();
try {
  const page = await context.newPage();
  await signInThroughForm(page, server.baseUrl, process.argv[2] ?? "coach@example.com");
  const sessions = (await (await page.request.get(`${server.baseUrl}/api/sessions`)).json()) as any;
  const list = sessions.sessions ?? sessions;
  const post = list.find((s: any) => s.squadName === "Academy U18" && s.phase === "post-block");
  for (const width of [1280, 820]) {
    await page.setViewportSize({ width, height: 900 });
    await page.goto(`${server.baseUrl}/sessions/${post.id}/import`);
    await page.locator('input[type="file"]').setInputFiles("examples/academy-post-block-catch-up-misspelt.csv");
    await page.getByRole("button", { name: "Use Luca Dempsey" }).waitFor();
    await page.screenshot({ path: `/tmp/look/import-${width}-1.png`, fullPage: true });
    if (width === 820) {
      await page.getByRole("button", { name: "Use Luca Dempsey" }).click();
      await page.getByText("reads as").first().waitFor();
      await page.getByRole("button", { name: /^Import \d+ results?$/ }).waitFor();
      await page.screenshot({ path: `/tmp/look/import-${width}-2.png`, fullPage: true });
      await page.getByRole("button", { name: /^Import \d+ results?$/ }).click();
      await page.getByText("Remembered for the next file").waitFor();
      await page.screenshot({ path: `/tmp/look/import-${width}-3.png`, fullPage: true });
    }
  }
  for (const width of [1280, 820]) {
    await page.setViewportSize({ width, height: 900 });
    await page.goto(`${server.baseUrl}/sessions/${post.id}`);
    await page.locator("table tbody tr").first().waitFor();
    await page.mouse.wheel(0, 700);
    await page.waitForTimeout(300);
    await page.screenshot({ path: `/tmp/look/sheet-${width}-scrolled.png` });
    const sx = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    console.log("sheet", width, "page sideways overflow", sx);
  }
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto(`${server.baseUrl}/tests`);
  await page.getByRole("heading", { name: "Test library" }).waitFor();
  await page.screenshot({ path: `/tmp/look/tests-1280.png`, fullPage: true });
} finally {
  await close();
  await server.stop();
}
