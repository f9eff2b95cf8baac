/**
 * Publishing a session mails its athletes over real SMTP (the local smtp-server fake): exactly one
 * mail per athlete with an account and the consent they need, holding only their own numbers;
 * none to an athlete without consent or a minor without a guardian's; no second mail when the
 * same results are published again, and an "updated" mail to the one athlete whose results changed.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq, ne } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { athletes, mailOutbox, results, squads, testingSessions, tests, users } from "@/db/schema";
import { sendQueuedMail } from "@/lib/data/mail";
import { readEml } from "@/lib/mail/eml";
import { startMailFake } from "@/scripts/mail-fake.mjs";
import { setupTestDatabase } from "../helpers/db";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const sessionRoute = await import("@/app/api/sessions/[sessionId]/route");
const checkRoute = await import("@/app/api/sessions/[sessionId]/publish-check/route");
const resultsRoute = await import("@/app/api/sessions/[sessionId]/results/route");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let dir: string;
let fake: Awaited<ReturnType<typeof startMailFake>>;
let post = 0;

const messages = () =>
  readdirSync(dir)
    .sort()
    .map((name) => readEml(readFileSync(join(dir, name), "utf8")));

async function setStatus(status: "published" | "draft") {
  const [row] = await env.db
    .select({ version: testingSessions.version })
    .from(testingSessions)
    .where(eq(testingSessions.id, post));
  await signInAs("scientist@example.com");
  const answer = await call(sessionRoute.PATCH, {
    method: "PATCH",
    params: { sessionId: `${post}` },
    body: { status, version: row.version },
  });
  expect(answer.status).toBe(200);
  // The route sends after its commit without waiting; this waits for that run (or starts one).
  await sendQueuedMail();
  return answer.json.session;
}

/** Gives an athlete record a sign-in account, as accepting an invitation would. */
async function giveAccount(name: string, email: string) {
  const [user] = await env.db.insert(users).values({ email, name }).returning({ id: users.id });
  await env.db.update(athletes).set({ userId: user.id }).where(eq(athletes.name, name));
}

beforeAll(async () => {
  env = await setupTestDatabase();
  dir = mkdtempSync(join(tmpdir(), "changewise-publish-"));
  fake = await startMailFake({ dir });
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String(fake.port);
  const [senior] = await env.db.select({ id: squads.id }).from(squads).where(eq(squads.name, "Senior Women"));
  [{ id: post }] = await env.db
    .select({ id: testingSessions.id })
    .from(testingSessions)
    .where(and(eq(testingSessions.squadId, senior.id), eq(testingSessions.phase, "post-block")));
  // The demo's two consent gaps get accounts too: having one must not be enough.
  await giveAccount("Noor Balfour", "noor@example.com");
  await giveAccount("Clío Nakashima", "clio@example.com");
});
afterAll(async () => {
  await fake.close();
  rmSync(dir, { recursive: true, force: true });
  env.cleanup();
});

/** An athlete's results in the post-block session, as the mail words them ("1.84 s"). */
async function numbersOf(name: string) {
  const rows = await env.db
    .select({ value: results.value, decimals: tests.decimals, unit: tests.unit })
    .from(results)
    .innerJoin(athletes, eq(athletes.id, results.athleteId))
    .innerJoin(tests, eq(tests.id, results.testId))
    .where(and(eq(results.sessionId, post), eq(athletes.name, name)));
  return rows.filter((r) => r.value !== null).map((r) => `${r.value!.toFixed(r.decimals)} ${r.unit}`);
}

describe("publishing mails each athlete their own results", () => {
  it("tells the publisher who will not see their results, and why", async () => {
    await signInAs("scientist@example.com");
    const { status, json } = await call(checkRoute.GET, { params: { sessionId: `${post}` } });
    expect(status).toBe(200);
    const byName = new Map(json.athletes.map((a: any) => [a.name, a]));
    expect(byName.get("Noor Balfour")).toMatchObject({ consent: { ok: false, missing: ["athlete"] }, mail: false });
    expect(byName.get("Clío Nakashima")).toMatchObject({
      consent: { ok: false, minor: true, missing: ["guardian"] },
      mail: false,
    });
    expect(byName.get("Tessa Lindqvist")).toMatchObject({ hasAccount: true, mail: true });
    expect(json.athletes.filter((a: any) => a.mail).map((a: any) => a.name)).toEqual([
      "Priya Damaschke",
      "Tessa Lindqvist",
    ]);
    expect(JSON.stringify(json)).not.toContain("@example.com");
    await signInAs("coach2@example.com");
    expect((await call(checkRoute.GET, { params: { sessionId: `${post}` } })).status).toBe(403);
  });

  it("sends exactly one mail per consenting athlete with an account, with only their own numbers", async () => {
    const session = await setStatus("published");
    expect(session.mailed).toBe(2);
    const sent = messages();
    expect(sent.map((m) => m.to).sort()).toEqual(["athlete2@example.com", "athlete@example.com"]);
    const outbox = await env.db.select({ kind: mailOutbox.kind, sentAt: mailOutbox.sentAt }).from(mailOutbox);
    expect(outbox).toHaveLength(2);
    expect(outbox.every((m) => m.kind === "results-published" && m.sentAt !== null)).toBe(true);

    const allNames = (await env.db.select({ name: athletes.name }).from(athletes)).map((a) => a.name);
    for (const [email, name, other] of [
      ["athlete@example.com", "Tessa Lindqvist", "Priya Damaschke"],
      ["athlete2@example.com", "Priya Damaschke", "Tessa Lindqvist"],
    ]) {
      const mail = sent.find((m) => m.to === email)!;
      expect(mail.subject).toBe("Your new results are in — Post-block testing on 2 Nov 2026");
      const own = await numbersOf(name);
      expect(own.length).toBeGreaterThan(3);
      for (const n of own) {
        expect(mail.text).toContain(n);
        expect(mail.html).toContain(n);
      }
      // Changes since the pre-block session, in the test's own direction.
      expect(mail.text).toMatch(/since 7 Sept? 2026: (an improvement|a step back), as (higher|lower) is better here/);
      for (const n of allNames.filter((x) => x !== name)) {
        expect(mail.text).not.toContain(n);
        expect(mail.html).not.toContain(n);
      }
      for (const n of (await numbersOf(other)).filter((x) => !own.includes(x)))
        expect(`${mail.text}\n${mail.html}`).not.toMatch(new RegExp(`(^|[^0-9.])${n.replace(".", "\\.")}`));
    }
  });

  it("does not mail again when the same results are published again; mails 'updated' to whoever changed", async () => {
    await setStatus("draft");
    await setStatus("published");
    expect(messages()).toHaveLength(2);

    await setStatus("draft");
    const [tessa] = await env.db.select({ id: athletes.id }).from(athletes).where(eq(athletes.name, "Tessa Lindqvist"));
    const [cmj] = await env.db.select({ id: tests.id }).from(tests).where(eq(tests.name, "Countermovement jump"));
    const [cell] = await env.db
      .select({ version: results.version })
      .from(results)
      .where(and(eq(results.sessionId, post), eq(results.athleteId, tessa.id), eq(results.testId, cmj.id)));
    await new Promise((r) => setTimeout(r, 5)); // a save later than the publication, to the millisecond
    const saved = await call(resultsRoute.PUT, {
      method: "PUT",
      params: { sessionId: `${post}` },
      body: { results: [{ athleteId: tessa.id, testId: cmj.id, trials: [39.7], flag: null, version: cell.version }] },
    });
    expect(saved.status).toBe(200);
    const session = await setStatus("published");
    expect(session.mailed).toBe(1);
    const sent = messages();
    expect(sent).toHaveLength(3);
    const updated = sent.find((m) => m.subject.startsWith("Your results were updated"))!;
    expect(updated.to).toBe("athlete@example.com");
    expect(updated.text).toContain("Countermovement jump: 39.7 cm");
    const others = await env.db.select({ name: athletes.name }).from(athletes).where(ne(athletes.id, tessa.id));
    for (const { name } of others) expect(updated.text).not.toContain(name);
  });
});
