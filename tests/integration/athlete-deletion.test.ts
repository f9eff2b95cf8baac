/**
 * Deleting an athlete is real deletion: after `DELETE /api/athletes/[id]` no row in any table
 * of the schema (found from sqlite_master, every column) holds the athlete's id — in a column
 * that refers to athletes, as an audit entry's subject, or under an athlete key inside JSON — or
 * their name, external id or account e-mail anywhere in text or bytes. The demo athlete first
 * gains every kind of trace the app can leave: results, squad places, an account with a reset
 * link and failed sign-ins, invitations, a deletion request and its mail, an uploaded file naming
 * them, audit entries, a saved report, a reliability study and notes that mention them.
 */
import { and, eq, ne } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import {
  athletes,
  auditEvents,
  invitations,
  passwordResetTokens,
  results,
  savedReports,
  signInAttempts,
  testingSessions,
  tests,
  uploads,
} from "@/db/schema";
import { setupTestDatabase, userIdOf } from "../helpers/db";
import { openMailbox } from "../helpers/mailbox";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const athleteRoute = await import("@/app/api/athletes/[athleteId]/route");
const previewRoute = await import("@/app/api/athletes/[athleteId]/deletion/route");
const deletionRequestRoute = await import("@/app/api/me/deletion-request/route");
const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");
const resetRoute = await import("@/app/api/password-reset/route");
const { loadActor } = await import("@/lib/data/actors");
const { saveReport } = await import("@/lib/data/reports");
const { adoptTypicalError } = await import("@/lib/data/reliability");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let mailbox: Awaited<ReturnType<typeof openMailbox>>;
beforeAll(async () => {
  env = await setupTestDatabase();
  mailbox = await openMailbox();
});
afterAll(async () => {
  await mailbox.close();
  env.cleanup();
});

type Target = { id: number; userId: number | null; words: string[] };

/** Every place in the database that still holds the athlete, as "table.column (rowid n): why". */
async function tracesOf(target: Target): Promise<string[]> {
  const client = getClient();
  const found: string[] = [];
  const { rows: tables } = await client.execute(
    "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%'",
  );
  const words = target.words.map((w) => w.toLowerCase());
  const walk = (value: unknown, where: string) => {
    if (Array.isArray(value)) {
      for (const [i, v] of value.entries()) walk(v, `${where}[${i}]`);
    } else if (value && typeof value === "object")
      for (const [key, v] of Object.entries(value)) {
        if (/^athleteIds?$/i.test(key) && [v].flat().includes(target.id)) found.push(`${where}.${key} = ${target.id}`);
        if (/^userId$/i.test(key) && target.userId !== null && v === target.userId)
          found.push(`${where}.${key} = user ${target.userId}`);
        walk(v, `${where}.${key}`);
      }
  };
  for (const t of tables) {
    const table = String(t.name);
    const fks = (await client.execute(`PRAGMA foreign_key_list("${table}")`)).rows;
    const athleteColumns = fks.filter((fk) => fk.table === "athletes").map((fk) => String(fk.from));
    const userColumns = fks.filter((fk) => fk.table === "users").map((fk) => String(fk.from));
    const { rows, columns } = await client.execute(`SELECT rowid AS __rowid, * FROM "${table}"`);
    for (const row of rows) {
      const at = (column: string) => `${table}.${column} (rowid ${row.__rowid})`;
      for (const column of columns) {
        if (column === "__rowid") continue;
        const value = row[column];
        if (athleteColumns.includes(column) && Number(value) === target.id) found.push(`${at(column)}: athlete id`);
        if (target.userId !== null && (userColumns.includes(column) || (table === "users" && column === "id")))
          if (Number(value) === target.userId) found.push(`${at(column)}: user id`);
        let text: string | null = null;
        if (typeof value === "string") text = value;
        else if (value instanceof ArrayBuffer || ArrayBuffer.isView(value))
          text = Buffer.from(value as ArrayBuffer).toString("utf8");
        if (text === null) continue;
        const lower = text.toLowerCase();
        for (const word of words) if (lower.includes(word)) found.push(`${at(column)}: "${word}"`);
        if (/^\s*[[{]/.test(text)) {
          try {
            walk(JSON.parse(text), at(column));
          } catch {
            // Not JSON: the words were checked above.
          }
        }
      }
      if (table === "audit_events" && row.entity_type === "athlete" && Number(row.entity_id) === target.id)
        found.push(`${at("entity_id")}: audit entry about the athlete`);
      if (
        table === "audit_events" &&
        target.userId !== null &&
        ["member", "user"].includes(String(row.entity_type)) &&
        Number(row.entity_id) === target.userId
      )
        found.push(`${at("entity_id")}: audit entry about the account`);
    }
  }
  return found;
}

describe("deleting an athlete", () => {
  let tessa: { id: number; name: string; externalId: string | null; userId: number | null };
  let target: Target;
  let keptUpload = 0;
  let resultsBefore = 0;
  let ownResults = 0;

  beforeAll(async () => {
    [tessa] = await env.db.select().from(athletes).where(eq(athletes.name, "Tessa Lindqvist"));
    const email = "athlete@example.com";
    target = { id: tessa.id, userId: tessa.userId, words: [tessa.name, tessa.externalId!, email] };
    const owner = (await loadActor(await userIdOf("owner@example.com")))!;
    const scientist = (await loadActor(await userIdOf("scientist@example.com")))!;
    const sessions = await env.db.select().from(testingSessions).where(eq(testingSessions.organizationId, 1));
    const senior = sessions.filter((s) => s.squadId === sessions[0].squadId);
    const byPhase = (phase: string) => senior.find((s) => s.phase === phase)!;
    const [cmj] = await env.db.select().from(tests).where(eq(tests.name, "Countermovement jump"));

    // Her own request, and the mail it sends the owners (which names her).
    await signInAs(email);
    expect(
      (await call(deletionRequestRoute.POST, { method: "POST", body: { message: "Please delete me." } })).status,
    ).toBe(201);
    await mailbox.messages();
    // A reset link and failed sign-ins of her account.
    expect((await call(resetRoute.POST, { method: "POST", body: { email } })).status).toBe(202);
    await env.db.insert(signInAttempts).values({ email, address: "direct", attemptedAt: Date.now() });
    // Sheet changes about her (audit entries with her id), and her record edited (entries with her name).
    await signInAs("scientist@example.com");
    const post = byPhase("post-block");
    const write = await call(resultsRoute.PUT, {
      method: "PUT",
      params: { sessionId: `${post.id}` },
      body: { results: [{ athleteId: tessa.id, testId: cmj.id, trials: [33.3], flag: null, version: 1 }] },
    });
    expect(write.status, JSON.stringify(write.json)).toBe(200);
    expect(
      (
        await call(athleteRoute.PATCH, {
          method: "PATCH",
          params: { athleteId: `${tessa.id}` },
          body: { position: "CB" },
        })
      ).status,
    ).toBe(200);
    // Notes and a test's source that mention her by name.
    await env.db
      .update(testingSessions)
      .set({ notes: `Retest; ${tessa.name} started late.` })
      .where(eq(testingSessions.id, post.id));
    const [other] = await env.db
      .select()
      .from(results)
      .where(and(eq(results.sessionId, post.id), ne(results.athleteId, tessa.id)))
      .limit(1);
    await env.db
      .update(results)
      .set({ note: `Paired with ${tessa.name}` })
      .where(eq(results.id, other.id));
    // Raw files: one names her (by external id, as exports do), one names only a teammate.
    const [mate] = await env.db
      .select()
      .from(athletes)
      .where(and(eq(athletes.organizationId, 1), ne(athletes.id, tessa.id)))
      .limit(1);
    const csv = (rows: string) => Buffer.from(`athlete,test,trial,value\n${rows}\n`, "utf8");
    await env.db.insert(uploads).values([
      {
        organizationId: 1,
        sessionId: post.id,
        filename: "gates.csv",
        sizeBytes: 60,
        content: csv(`${tessa.externalId},Countermovement jump,1,33.3\n${mate.externalId},Countermovement jump,1,30.1`),
        rowsImported: 2,
      },
      {
        organizationId: 1,
        sessionId: post.id,
        filename: "others.csv",
        sizeBytes: 40,
        content: csv(`${mate.externalId},Countermovement jump,1,30.1`),
        rowsImported: 1,
      },
    ]);
    keptUpload = (await env.db.select().from(uploads).where(eq(uploads.filename, "others.csv")))[0].id;
    // An invitation that named her record (accepted long ago).
    await env.db.insert(invitations).values({
      organizationId: 1,
      email,
      role: "athlete",
      athleteId: tessa.id,
      tokenHash: "0".repeat(64),
      expiresAt: new Date(),
      acceptedAt: new Date(),
    });
    // A saved report and a reliability study that list her among the squad.
    await saveReport(scientist, {
      testId: cmj.id,
      fromSessionId: byPhase("pre-block").id,
      toSessionId: post.id,
      confidence: 0.9,
      note: `Squad improved; ${tessa.name} the most.`,
    });
    await adoptTypicalError(scientist, cmj.id, {
      firstSessionId: byPhase("baseline").id,
      secondSessionId: byPhase("retest").id,
    });
    expect(owner.role).toBe("owner");
    resultsBefore = (await env.db.select().from(results)).length;
    ownResults = (await env.db.select().from(results).where(eq(results.athleteId, tessa.id))).length;
  });

  it("the checker sees her everywhere before the deletion", async () => {
    const found = await tracesOf(target);
    for (const table of [
      "results",
      "squad_athletes",
      "users",
      "memberships",
      "invitations",
      "deletion_requests",
      "uploads",
      "audit_events",
      "saved_reports",
      "reliability_studies",
      "mail_outbox",
      "sign_in_attempts",
      "password_reset_tokens",
      "testing_sessions",
      "athletes",
    ])
      expect(
        found.some((f) => f.startsWith(`${table}.`)),
        table,
      ).toBe(true);
  });

  it("is the owner's alone; others get 403, another organisation 404", async () => {
    for (const who of ["scientist@example.com", "coach2@example.com", "athlete@example.com"]) {
      await signInAs(who);
      expect((await call(athleteRoute.DELETE, { method: "DELETE", params: { athleteId: `${tessa.id}` } })).status).toBe(
        403,
      );
    }
    await signInAs("owner@other.example.com");
    expect((await call(athleteRoute.DELETE, { method: "DELETE", params: { athleteId: `${tessa.id}` } })).status).toBe(
      404,
    );
    expect((await call(previewRoute.GET, { params: { athleteId: `${tessa.id}` } })).status).toBe(404);
  });

  it("counts what will go, deletes it all in one go, and leaves no trace in any table", async () => {
    await signInAs("owner@example.com");
    const preview = await call(previewRoute.GET, { params: { athleteId: `${tessa.id}` } });
    expect(preview.status).toBe(200);
    expect(preview.json.counts).toMatchObject({
      results: ownResults,
      squads: 1,
      account: "deleted",
      invitations: 1,
      deletionRequests: 1,
      uploads: 1,
      savedReports: 1,
      reliabilityStudies: 1,
    });
    expect(preview.json.counts.auditEntries).toBeGreaterThanOrEqual(3);
    expect(preview.json.counts.mails).toBeGreaterThanOrEqual(2);

    const deleted = await call(athleteRoute.DELETE, { method: "DELETE", params: { athleteId: `${tessa.id}` } });
    expect(deleted.status).toBe(200);
    expect(deleted.json.deleted).toMatchObject(preview.json.counts);
    expect(deleted.json.deleted.notes).toBeGreaterThanOrEqual(2);

    expect(await tracesOf(target)).toEqual([]);

    // Everyone else's data stays.
    expect((await env.db.select().from(results)).length).toBe(resultsBefore - ownResults);
    expect((await env.db.select().from(uploads).where(eq(uploads.id, keptUpload))).length).toBe(1);
    const [report] = await env.db.select().from(savedReports);
    expect(report.note).toBe("Squad improved; [deleted athlete] the most.");
    expect((await env.db.select().from(passwordResetTokens)).length).toBe(0);
    const [record] = await env.db.select().from(auditEvents).where(eq(auditEvents.action, "athlete.delete"));
    expect(record).toMatchObject({ entityType: "athlete", entityId: null });
    // Her old session is gone with her account.
    await signInAs("owner@example.com");
    expect((await call(athleteRoute.DELETE, { method: "DELETE", params: { athleteId: `${tessa.id}` } })).status).toBe(
      404,
    );
  });
});
