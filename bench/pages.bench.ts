/**
 * Page benchmarks in Debian's Chromium against the production build on the demo club.
 *
 * - sheet-rows-visible-ms: median time from navigating (a full page load from the Test library) to a
 *   Session sheet, warm server, signed in as the scientist, until its first athlete row is on screen.
 * - sheet-first-load-js-kb: gzipped JavaScript the Session sheet loads on a cold cache.
 * - change-report-first-load-kb: gzipped JavaScript the Change report's document names, which is
 *   what must arrive before it is usable (its charts load lazily after; the total is in the detail).
 */
import { chromium, type Page } from "playwright-core";
import { ensureChromium } from "../tests/helpers/chromium";
import { startProductionServer } from "../tests/helpers/server";
import type { BenchResult } from "./harness";

const ROUNDS = 12;
const ROW = "table tbody tr.group";

async function signIn(page: Page, baseUrl: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill("scientist@example.com");
  await page.getByLabel("Password").fill("changewise-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
}

/**
 * Bytes of JavaScript as sent over the wire (gzip or brotli) for one page load on an empty cache:
 * `initial`, the scripts the document itself names (what must arrive before the page is usable),
 * and `total`, everything loaded until the network is idle (lazily loaded charts included).
 */
async function firstLoadJsBytes(page: Page, url: string): Promise<{ initial: number; total: number }> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.clearBrowserCache");
  const parserLoaded = new Set<string>();
  const scripts = new Set<string>();
  let initial = 0;
  let total = 0;
  // Scripts the HTML names are fetched by the parser (or its preloads); the charts by script.
  cdp.on("Network.requestWillBeSent", (e) => {
    if (e.initiator.type === "parser" || e.initiator.type === "preload") parserLoaded.add(e.requestId);
  });
  cdp.on("Network.responseReceived", (e) => {
    if (e.type === "Script") scripts.add(e.requestId);
  });
  cdp.on("Network.loadingFinished", (e) => {
    if (!scripts.has(e.requestId)) return;
    total += e.encodedDataLength;
    if (parserLoaded.has(e.requestId)) initial += e.encodedDataLength;
  });
  await page.goto(url, { waitUntil: "networkidle" });
  await cdp.detach();
  return { initial, total };
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};

export default async function pages(): Promise<BenchResult[]> {
  // Before the build, so a machine without a browser learns it at once.
  const executablePath = ensureChromium("npm run bench");
  const server = await startProductionServer();
  const browser = await chromium.launch({
    executablePath,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
    ],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, server.baseUrl);
    const { sessions } = (await (await page.request.get(`${server.baseUrl}/api/sessions`)).json()) as {
      sessions: { id: number; resultCount: number }[];
    };
    const busiest = sessions.reduce((a, b) => (b.resultCount > a.resultCount ? b : a));
    const url = `${server.baseUrl}/sessions/${busiest.id}`;
    const jsBytes = await firstLoadJsBytes(page, url);
    const reportBytes = await firstLoadJsBytes(page, `${server.baseUrl}/reports/change`);
    // Warm the server's caches and the browser's before timing.
    for (let i = 0; i < 3; i++) await page.goto(url).then(() => page.waitForSelector(ROW));
    const times: number[] = [];
    for (let i = 0; i < ROUNDS; i++) {
      // From another page of the app, as a coach arrives: from about:blank the browser would
      // also start a new renderer process (our Cross-Origin-Opener-Policy), a cost no user pays.
      await page.goto(`${server.baseUrl}/tests`);
      const started = performance.now();
      await page.goto(url, { waitUntil: "commit" });
      await page.waitForSelector(ROW, { state: "visible" });
      times.push(performance.now() - started);
    }
    return [
      {
        name: "sheet-rows-visible-ms",
        value: Number(median(times).toFixed(1)),
        unit: "ms",
        detail: `median of ${ROUNDS} navigations to the busiest demo Session sheet (${busiest.resultCount} results), warm server`,
      },
      {
        name: "change-report-first-load-kb",
        value: Number((reportBytes.initial / 1024).toFixed(1)),
        unit: "kB",
        target: 200,
        detail: `compressed JavaScript the Change report's document names (usable with it; the charts follow lazily, ${(reportBytes.total / 1024).toFixed(1)} kB in all)`,
      },
      {
        name: "sheet-first-load-js-kb",
        value: Number((jsBytes.total / 1024).toFixed(1)),
        unit: "kB",
        detail: "compressed JavaScript the Session sheet loads on an empty cache",
      },
    ];
  } finally {
    await browser.close();
    await server.stop();
  }
}
