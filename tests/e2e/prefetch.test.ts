/**
 * One loading state per page: the server reads the page's data and streams the screen with it,
 * so the HTML already holds the rows and never a client-side "Loading…" line.
 */
import { describe, expect, inject, it } from "vitest";
import { HttpSession } from "../helpers/http";

const baseUrl = inject("baseUrl");

async function html(session: HttpSession, path: string) {
  const response = await session.fetch(path);
  expect(response.status).toBe(200);
  return response.text();
}

describe("server-prefetched pages", () => {
  it("stream their data in the first response, for staff and athletes", async () => {
    const scientist = new HttpSession(baseUrl);
    await scientist.signIn("scientist@example.com");
    const { json } = await scientist.json("/api/sessions");
    const busiest = json.sessions.reduce((a: { resultCount: number }, b: { resultCount: number }) =>
      b.resultCount > a.resultCount ? b : a,
    );
    const sheet = await scientist.json(`/api/sessions/${busiest.id}`);
    const squads = await scientist.json("/api/squads");
    // The demo's test–retest pair: Senior Women baseline and retest, on the CMJ.
    type Listed = { id: number; squadName: string; phase: string };
    // The earliest of each phase: other browser tests add Senior Women sessions, a retest among them.
    const day = (phase: string) =>
      json.sessions.filter((s: Listed) => s.squadName === "Senior Women" && s.phase === phase).at(-1).id;
    const cmj = (await scientist.json("/api/tests")).json.tests.find(
      (t: { name: string }) => t.name === "Countermovement jump",
    );
    const reliability = `testId=${cmj.id}&firstSessionId=${day("baseline")}&secondSessionId=${day("retest")}&confidence=0.95`;
    const study = await scientist.json(`/api/reports/reliability?${reliability}`);

    const pages: [string, string[]][] = [
      ["/", squads.json.squads.map((s: { name: string }) => s.name)],
      [`/squads/${squads.json.squads[0].id}`, ["Add athlete"]],
      ["/tests", ["Countermovement jump", "10 m sprint"]],
      ["/sessions", [busiest.squadName]],
      [`/sessions/${busiest.id}`, [sheet.json.athletes[0].name, sheet.json.athletes.at(-1).name, "Recent changes"]],
      ["/", ["What needs doing"]],
      [`/athletes/${sheet.json.athletes[0].id}`, [sheet.json.athletes[0].name, "Athlete history"]],
      [`/reports/reliability?${reliability}`, ["Test–retest result", study.json.pairs[0].name, "Planner"]],
    ];
    for (const [path, expected] of pages) {
      const body = await html(scientist, path);
      for (const text of expected) expect(body, `${path} holds ${text}`).toContain(text.replaceAll("&", "&amp;"));
      expect(body, `${path} has no client loading line`).not.toMatch(
        /Loading (the Session sheet|squads|sessions|the Test library|athletes|changes)…/,
      );
    }

    const owner = new HttpSession(baseUrl);
    await owner.signIn("owner@example.com");
    for (const [path, expected] of [
      ["/people", ["Rhiannon Cole", "scientist@example.com", "Invitations ("]],
      ["/outbox", ["Queue ("]],
    ] as const) {
      const body = await html(owner, path);
      for (const text of expected) expect(body, `${path} holds ${text}`).toContain(text);
    }

    const athlete = new HttpSession(baseUrl);
    await athlete.signIn("athlete@example.com");
    const own = await athlete.json("/api/me");
    const results = await athlete.json(`/api/athletes/${own.json.athleteId}/results`);
    expect(results.json.results.length).toBeGreaterThan(0);
    const home = await html(athlete, "/");
    expect(home).toContain(results.json.results[0].testName);
    expect(home).not.toContain("Loading your results");
  });
});
