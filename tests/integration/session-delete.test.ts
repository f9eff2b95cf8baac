/**
 * Deleting a draft session made by mistake: who may, the confirm step's count, and that its
 * results and raw import files go with it while the change log keeps a note.
 */
import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditEvents, results, squads, testingSessions, tests, uploads } from "@/db/schema";
import { setupTestDatabase } from "../helpers/db";
import { uploadTo } from "../helpers/import-upload";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const sessionsRoute = await import("@/app/api/sessions/route");
const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");
const importRoute = await import("@/app/api/sessions/[sessionId]/import/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
const ids = { academy: 0, senior: 0, cmj: 0 };

beforeAll(async () => {
  env = await setupTestDatabase();
  const sq = await env.db.select({ id: squads.id, name: squads.name }).from(squads);
  ids.academy = sq.find((s) => s.name === "Academy U18")!.id;
  ids.senior = sq.find((s) => s.name === "Senior Women")!.id;
  ids.cmj = (await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "Countermovement jump")))[0].id;
});
afterAll(() => env.cleanup());

const create = async (squadId: number) =>
  (
    await call(sessionsRoute.POST, {
      method: "POST",
      body: { squadId, date: "2026-11-30", phase: "in-season", testIds: [ids.cmj] },
    })
  ).json.session.id as number;
const remove = (sessionId: number, confirmed: number | string | null) =>
  call(sessionRoute.DELETE, {
    method: "DELETE",
    params: { sessionId: String(sessionId) },
    url: `http://test.local/api/sessions/${sessionId}${confirmed === null ? "" : `?results=${confirmed}`}`,
  });
const held = async (sessionId: number) =>
  (await env.db.select({ n: count() }).from(results).where(eq(results.sessionId, sessionId)))[0].n;

describe("DELETE /api/sessions/[id]", () => {
  it("deletes a draft with its results and import file once the count matches, and notes it in the log", async () => {
    await signInAs("scientist@example.com");
    const id = await create(ids.academy);
    const imported = await uploadTo(
      importRoute.POST,
      id,
      "athlete,test,trial,value\nTheo Varga,Countermovement jump,1,39.5\n",
    );
    expect(imported.status).toBe(200);
    expect(await held(id)).toBe(1);

    const stale = await remove(id, 0);
    expect(stale.status).toBe(409);
    expect(stale.json.error.message).toMatch(/now holds 1 result, not 0/);
    expect(await held(id)).toBe(1);

    const done = await remove(id, 1);
    expect(done.status).toBe(200);
    expect(done.json).toEqual({ id, deletedResults: 1 });
    expect(await env.db.select().from(testingSessions).where(eq(testingSessions.id, id))).toEqual([]);
    expect(await held(id)).toBe(0);
    expect(await env.db.select().from(uploads).where(eq(uploads.sessionId, id))).toEqual([]);
    const [note] = await env.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.action, "session.delete"), eq(auditEvents.entityId, id)));
    expect(note.before).toMatchObject({ id, results: 1, status: "draft" });
  });

  it("lets a coach delete only the drafts they created", async () => {
    await signInAs("coach@example.com");
    const own = await create(ids.academy);
    await signInAs("scientist@example.com");
    const theirs = await create(ids.academy);
    await signInAs("coach@example.com");
    expect((await remove(theirs, 0)).status).toBe(403);
    expect((await remove(own, 0)).status).toBe(200);
    await signInAs("coach2@example.com");
    expect((await remove(theirs, 0)).status).toBe(404);
    await signInAs("athlete@example.com");
    expect((await remove(theirs, 0)).status).toBe(403);
  });

  it("refuses a published session and a request without the confirmed count", async () => {
    await signInAs("owner@example.com");
    const [published] = await env.db
      .select({ id: testingSessions.id })
      .from(testingSessions)
      .where(and(eq(testingSessions.squadId, ids.senior), eq(testingSessions.status, "published")));
    const refused = await remove(published.id, await held(published.id));
    expect(refused.status).toBe(403);
    expect(refused.json.error.message).toMatch(/back to draft first/);
    const id = await create(ids.senior);
    for (const bad of [null, "", "-1", "1.5", "x"]) expect((await remove(id, bad)).status, String(bad)).toBe(422);
    expect(await env.db.select().from(testingSessions).where(eq(testingSessions.id, id))).toHaveLength(1);
  });
});
