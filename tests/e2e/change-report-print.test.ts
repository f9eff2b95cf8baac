/**
 * The printed Change report for a full squad: 30 athletes, a test with a typical error (so the
 * athlete table carries its interval column) and long names — still one A4 landscape page,
 * with the cautions at its foot. The squad is built through the API with invented athletes and
 * seeded scores; its sessions are dated early in the year so no other test takes them for "the
 * latest".
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { mulberry32 } from "@/scripts/seeded-random";
import { openBrowser, screenshot, signInThroughForm } from "../helpers/browser";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

const FIRST = ["Maren", "Oluwaseun", "Ilse", "Jun", "Caoimhe", "Adaeze", "Birgitta", "Tomasz", "Leilani", "Rafaela"];
const LAST = ["Ashcombe-Varga", "Nwachukwu", "Lindqvist", "Okonkwo-Bell", "Fairbairn", "Castellanos", "Huang"];

async function buildSquad(http: HttpSession) {
  const post = (path: string, body: unknown, method = "POST") =>
    http.json(path, {
      method,
      headers: { "content-type": "application/json", origin: baseUrl },
      body: JSON.stringify(body),
    });
  const tests = (await http.json("/api/tests")).json.tests as { id: number; name: string }[];
  const run = tests.find((t) => t.name === "Intermittent recovery run (level 1)")!;
  const squad = (await post("/api/squads", { name: "Print check squad", sport: "Field hockey" })).json.squad;
  const athletes: number[] = [];
  for (let i = 0; i < 30; i++) {
    const name = `${FIRST[i % FIRST.length]} ${LAST[(i * 3) % LAST.length]} ${String.fromCharCode(65 + (i % 26))}.`;
    const added = await post(`/api/squads/${squad.id}/athletes`, { name });
    expect(added.status, JSON.stringify(added.json)).toBe(201);
    athletes.push(added.json.athlete.id);
  }
  const session = async (date: string, phase: string) =>
    (await post("/api/sessions", { squadId: squad.id, date, phase, testIds: [run.id] })).json.session.id as number;
  const pre = await session("2026-01-12", "pre-block");
  const post_ = await session("2026-03-09", "post-block");
  const random = mulberry32(30);
  const metres = (base: number) => Math.round((base + (random() - 0.5) * 400) / 40) * 40;
  for (const [sessionId, shift] of [
    [pre, 0],
    [post_, 160],
  ]) {
    const written = await post(
      `/api/sessions/${sessionId}/results`,
      {
        results: athletes.map((athleteId, i) => ({
          athleteId,
          testId: run.id,
          trials: [metres(1480 + shift + (i % 5) * 40)],
          flag: null,
          version: null,
        })),
      },
      "PUT",
    );
    expect(written.status, JSON.stringify(written.json).slice(0, 300)).toBe(200);
  }
  return { testId: run.id, pre, post: post_ };
}

describe("Change report in print", () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser?.close());

  it("fits a 30-athlete squad on one A4 landscape page with the cautions at its foot", async () => {
    const http = new HttpSession(baseUrl);
    await http.signIn("owner@example.com");
    const { testId, pre, post } = await buildSquad(http);

    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughForm(page, baseUrl, "scientist@example.com");
    await page.goto(
      `${baseUrl}/reports/change?testId=${testId}&fromSessionId=${pre}&toSessionId=${post}&confidence=0.9`,
    );
    await page.getByRole("heading", { name: "Squad result" }).waitFor();
    await page.getByRole("columnheader", { name: "Interval (typical error)" }).waitFor();
    expect(await page.locator("table tbody tr").count()).toBeGreaterThanOrEqual(30);
    await expect.poll(() => page.locator("canvas").count()).toBe(3);

    await page.emulateMedia({ media: "print" });
    await screenshot(page, "change-report-print-30");
    const pdf = await page.pdf({
      format: "A4",
      landscape: true,
      printBackground: true,
      path: "tests/.artifacts/change-report-30.pdf",
    });
    expect(pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g)?.length).toBe(1);
    // The foot of the page carries the cautions (PRODUCT.md §8).
    await page
      .getByText(/not a medical or return-to-play judgement/)
      .first()
      .waitFor();
    await page.close();
  });
});
