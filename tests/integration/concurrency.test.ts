import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import { athletes, squadAthletes, squads, testingSessions, tests } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");
const sessionsRoute = await import("@/app/api/sessions/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
beforeAll(async () => {
  env = await setupTestDatabase();
});
afterAll(() => env.cleanup());

describe("concurrent writes in one server process", () => {
  it("many saves at once, with reads in between, all answer 200 or 409 — never a 500", async () => {
    await signInAs("scientist@example.com");
    const [squad] = await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women"));
    const [cmj] = await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "Countermovement jump"));
    const created = await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId: squad.id, date: "2026-12-02", phase: "retest", testIds: [cmj.id] },
    });
    const sessionId = String(created.json.session.id);
    const roster = await env.db
      .select({ id: athletes.id })
      .from(squadAthletes)
      .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
      .where(and(eq(squadAthletes.squadId, squad.id)));

    const writes = roster.map((a, i) =>
      call(resultsRoute.PUT, {
        method: "PUT",
        params: { sessionId },
        body: { results: [{ athleteId: a.id, testId: cmj.id, trials: [30 + i / 10], flag: null, version: null }] },
      }),
    );
    // The same cell twice at once: one wins, the other must be told (409), not overwritten.
    const clash = [0, 1].map(() =>
      call(resultsRoute.PUT, {
        method: "PUT",
        params: { sessionId },
        body: { results: [{ athleteId: roster[0].id, testId: cmj.id, trials: [99], flag: null, version: 1 }] },
      }),
    );
    const reads = [0, 1, 2].map(() => call(sessionRoute.GET, { params: { sessionId } }));
    const answers = await Promise.all([...writes, ...clash, ...reads]);

    expect(answers.slice(0, writes.length).every((a) => a.status === 200)).toBe(true);
    expect(
      answers
        .slice(writes.length, writes.length + 2)
        .map((a) => a.status)
        .sort(),
    ).toEqual([200, 409]);
    expect(answers.slice(-3).every((a) => a.status === 200)).toBe(true);

    const sheet = await call(sessionRoute.GET, { params: { sessionId } });
    expect(sheet.json.results).toHaveLength(roster.length);
    expect(sheet.json.results.find((r: any) => r.athleteId === roster[0].id)).toMatchObject({
      trials: [99],
      version: 2,
    });
    const [row] = await env.db
      .select({ status: testingSessions.status })
      .from(testingSessions)
      .where(eq(testingSessions.id, Number(sessionId)));
    expect(row.status).toBe("draft");
  });

  it("20 writers at once on one set of cells: accepted + 409 = sent, and no accepted write is lost", async () => {
    await signInAs("coach2@example.com");
    const [squad] = await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women"));
    const battery = await env.db
      .select({ id: tests.id, name: tests.name })
      .from(tests)
      .where(eq(tests.organizationId, 1));
    const cmj = battery.find((t) => t.name === "Countermovement jump")!.id;
    const sprint = battery.find((t) => t.name === "10 m sprint")!.id;
    const created = await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId: squad.id, date: "2026-12-03", phase: "retest", testIds: [cmj, sprint] },
    });
    const sessionId = String(created.json.session.id);
    const [maren] = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Maren Oduya"));
    const WRITERS = 20;

    // Each writer saves the same two cells (jump and sprint) in one batch, with its own scores.
    const batch = (writer: number, versions: [number | null, number | null]) => ({
      results: [
        { athleteId: maren.id, testId: cmj, trials: [30 + writer / 10], flag: null, version: versions[0] },
        { athleteId: maren.id, testId: sprint, trials: [1.8 + writer / 1000], flag: null, version: versions[1] },
      ],
    });
    const tally = { sent: 0, accepted: 0, conflicts: 0, other: 0 };
    const save = async (writer: number, versions: [number | null, number | null]) => {
      tally.sent++;
      const answer = await call(resultsRoute.PUT, {
        method: "PUT",
        params: { sessionId },
        body: batch(writer, versions),
      });
      if (answer.status === 200) tally.accepted++;
      else if (answer.status === 409) tally.conflicts++;
      else tally.other++;
      return answer;
    };

    // Round 1: everyone writes blind into the empty cells; exactly one may create them.
    await Promise.all(Array.from({ length: WRITERS }, (_, w) => save(w, [null, null])));
    expect(tally).toMatchObject({ sent: WRITERS, accepted: 1, conflicts: WRITERS - 1, other: 0 });

    // Round 2: everyone at once again, each retrying with the versions its 409 reported, as the
    // sheet does after showing who changed the cell; every writer gets through exactly once.
    await Promise.all(
      Array.from({ length: WRITERS }, async (_, w) => {
        let versions: [number | null, number | null] = [1, 1];
        for (let attempt = 0; attempt < 200; attempt++) {
          const answer = await save(100 + w, versions);
          if (answer.status === 200) return;
          const current = answer.json.error.details.conflicts as {
            testId: number;
            current: { version: number } | null;
          }[];
          const now = (testId: number) =>
            current.find((c) => c.testId === testId)?.current?.version ?? versions[testId === cmj ? 0 : 1];
          versions = [now(cmj), now(sprint)];
        }
        throw new Error(`writer ${w} never got through`);
      }),
    );
    expect(tally.other).toBe(0);
    expect(tally.accepted + tally.conflicts).toBe(tally.sent);
    expect(tally.accepted).toBe(1 + WRITERS);

    // Nothing lost: each cell's version counts every accepted write, and the audit holds one
    // entry per accepted write per cell, versions 1…n without gaps, ending at what is stored.
    const client = getClient();
    for (const testId of [cmj, sprint]) {
      const { rows } = await client.execute({
        sql: "SELECT id, version, trials FROM results WHERE session_id = ? AND athlete_id = ? AND test_id = ?",
        args: [Number(sessionId), maren.id, testId],
      });
      expect(Number(rows[0].version)).toBe(tally.accepted);
      const audit = await client.execute({
        sql: "SELECT action, after FROM audit_events WHERE session_id = ? AND entity_type = 'result' AND entity_id = ? ORDER BY id",
        args: [Number(sessionId), Number(rows[0].id)],
      });
      const afters = audit.rows.map((r) => JSON.parse(String(r.after)) as { version: number; trials: number[] });
      expect(afters.map((a) => a.version)).toEqual(Array.from({ length: tally.accepted }, (_, i) => i + 1));
      expect(afters.at(-1)!.trials).toEqual(JSON.parse(String(rows[0].trials)));
      // Every round-2 writer's score is in the history exactly once.
      const scores = afters.map((a) => a.trials[0]);
      for (let w = 0; w < WRITERS; w++)
        expect(
          scores.filter((x) => x === (testId === cmj ? 30 + (100 + w) / 10 : 1.8 + (100 + w) / 1000)),
        ).toHaveLength(1);
    }
    console.log(
      `concurrency: ${WRITERS} writers, ${tally.sent} saves sent, ${tally.accepted} accepted + ${tally.conflicts} × 409 = ${tally.accepted + tally.conflicts}, final version ${tally.accepted}, 0 lost`,
    );
  });
});
