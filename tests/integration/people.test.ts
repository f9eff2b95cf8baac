/**
 * People: invitations (create, mail, accept, resend, revoke, expiry, single use), members and
 * their roles (the last owner stays), removal ending sessions, and an athlete's deletion request.
 * Mail goes over real SMTP to the local fake; the links are read back from the .eml files.
 */
import { createHash } from "node:crypto";
import { and, eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { getClient } from "@/db/client";
import { athletes, auditEvents, deletionRequests, invitations, memberships, users } from "@/db/schema";
import { DEMO_ORG } from "@/scripts/demo-data";
import { setupTestDatabase, userIdOf } from "../helpers/db";
import { openMailbox, tokenIn } from "../helpers/mailbox";
import { call, sessionMock, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", () => sessionMock);

const invitationsRoute = await import("@/app/api/invitations/route");
const invitationRoute = await import("@/app/api/invitations/[invitationId]/route");
const resendRoute = await import("@/app/api/invitations/[invitationId]/resend/route");
const acceptRoute = await import("@/app/api/invitations/accept/route");
const membersRoute = await import("@/app/api/members/route");
const memberRoute = await import("@/app/api/members/[userId]/route");
const meRoute = await import("@/app/api/me/route");
const deletionRequestRoute = await import("@/app/api/me/deletion-request/route");
const deletionRequestsRoute = await import("@/app/api/deletion-requests/route");
const { authorizeCredentials } = await import("@/lib/auth/credentials");
const { loadActor } = await import("@/lib/data/actors");

let env: Awaited<ReturnType<typeof setupTestDatabase>>;
let mailbox: Awaited<ReturnType<typeof openMailbox>>;
/** Every line written to the console during the tests: no token may appear in it. */
const consoleLines: string[] = [];
const tokensSeen: string[] = [];

beforeAll(async () => {
  env = await setupTestDatabase();
  mailbox = await openMailbox();
  for (const method of ["log", "info", "warn", "error", "debug"] as const) {
    const original = console[method];
    vi.spyOn(console, method).mockImplementation((...args: unknown[]) => {
      consoleLines.push(args.map(String).join(" "));
      original(...args);
    });
  }
});
afterAll(async () => {
  vi.restoreAllMocks();
  await mailbox.close();
  env.cleanup();
});

const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");

async function invite(body: Record<string, unknown>) {
  await signInAs("owner@example.com");
  return call(invitationsRoute.POST, { method: "POST", body });
}

/** Invites and returns the invitation's id and the token from the mail. */
async function inviteAndRead(email: string, role: string, athleteId?: number) {
  const answer = await invite({ email, role, ...(athleteId ? { athleteId } : {}) });
  expect(answer.status, JSON.stringify(answer.json)).toBe(201);
  const token = tokenIn((await mailbox.latestTo(email)).text, "invitations");
  tokensSeen.push(token);
  return { id: answer.json.invitation.id as number, token };
}

const accept = (token: string, name = "New Person", password = "a-long-enough-password") =>
  call(acceptRoute.POST, { method: "POST", body: { token, name, password } });

const unlinkedAthlete = async () => {
  const [row] = await env.db
    .select({ id: athletes.id, name: athletes.name })
    .from(athletes)
    .where(and(isNull(athletes.userId), eq(athletes.organizationId, 1)))
    .limit(1);
  return row;
};

describe("invitations", () => {
  it("refuses bad input with 422 and a clear message, never a 500", async () => {
    for (const body of [
      { email: "not-an-address", role: "coach" },
      { email: "x@example.com", role: "captain" },
      { email: "x@example.com" },
      { email: "x@example.com", role: "athlete" },
      { email: "x@example.com", role: "coach", athleteId: 5 },
      { email: "", role: "coach" },
    ]) {
      const { status, json } = await invite(body);
      expect(status, JSON.stringify(body)).toBe(422);
      expect(json.error.message).toBeTruthy();
    }
  });

  it("refuses an address that is already a member, and an athlete who already has an account", async () => {
    expect((await invite({ email: "coach@example.com", role: "coach" })).status).toBe(409);
    const [tessa] = await env.db.select().from(athletes).where(eq(athletes.name, "Tessa Lindqvist"));
    const { status, json } = await invite({ email: "tessa.new@example.com", role: "athlete", athleteId: tessa.id });
    expect(status).toBe(409);
    expect(json.error.message).toMatch(/already has an account/);
  });

  it("refuses an athlete of another organisation as not found", async () => {
    const [rower] = await env.db.select().from(athletes).where(eq(athletes.organizationId, 2)).limit(1);
    expect((await invite({ email: "rower@example.com", role: "athlete", athleteId: rower.id })).status).toBe(404);
  });

  it("mails a link, stores only the token's hash, and a second invitation to the address is 409", async () => {
    const { id, token } = await inviteAndRead("new.coach@example.com", "coach");
    const [row] = await env.db.select().from(invitations).where(eq(invitations.id, id));
    expect(row.tokenHash).toBe(sha256(token));
    expect(row.tokenHash).not.toContain(token);
    const mail = await mailbox.latestTo("new.coach@example.com");
    expect(mail.subject).toBe(`Join ${DEMO_ORG} on Changewise`);
    expect(mail.text).toContain("as a coach");
    const again = await invite({ email: "NEW.coach@example.com", role: "scientist" });
    expect(again.status).toBe(409);
    expect(again.json.error.message).toMatch(/already waiting/);
    const list = await call(invitationsRoute.GET);
    expect(list.status).toBe(200);
    expect(list.json.invitations.map((i: { email: string }) => i.email)).toContain("new.coach@example.com");
  });

  it("accepting creates the account and membership, signs in, and works once", async () => {
    const { token } = await inviteAndRead("ada.coach@example.com", "coach");
    const first = await accept(token, "Ada Okonkwo", "ada-chooses-this-one");
    expect(first.status, JSON.stringify(first.json)).toBe(201);
    expect(first.json.accepted).toEqual({ email: "ada.coach@example.com" });
    const userId = await userIdOf("ada.coach@example.com");
    const actor = await loadActor(userId);
    expect(actor).toMatchObject({ role: "coach", name: "Ada Okonkwo", organizationId: 1 });
    expect(
      await authorizeCredentials({ email: "ada.coach@example.com", password: "ada-chooses-this-one" }, "direct"),
    ).toMatchObject({ email: "ada.coach@example.com" });
    const second = await accept(token, "Someone Else", "another-password-here");
    expect(second.status).toBe(404);
    expect(second.json.error.message).toMatch(/does not work any more/);
  });

  it("an athlete invitation links the athlete record to the new account", async () => {
    const athlete = await unlinkedAthlete();
    const { token } = await inviteAndRead("claimed@example.com", "athlete", athlete.id);
    // The athlete is no longer offered for another invitation while this one waits.
    const list = await call(invitationsRoute.GET);
    expect(list.json.claimableAthletes.map((a: { id: number }) => a.id)).not.toContain(athlete.id);
    expect((await accept(token, athlete.name, "athlete-password-1")).status).toBe(201);
    const userId = await userIdOf("claimed@example.com");
    const [linked] = await env.db.select().from(athletes).where(eq(athletes.id, athlete.id));
    expect(linked.userId).toBe(userId);
    expect(await loadActor(userId)).toMatchObject({ role: "athlete", athleteId: athlete.id });
  });

  it("sending again replaces the token: the old link stops working, the new one works", async () => {
    const { id, token: old } = await inviteAndRead("resent@example.com", "scientist");
    const resent = await call(resendRoute.POST, { method: "POST", params: { invitationId: `${id}` } });
    expect(resent.status).toBe(200);
    const fresh = tokenIn((await mailbox.latestTo("resent@example.com")).text, "invitations");
    tokensSeen.push(fresh);
    expect(fresh).not.toBe(old);
    expect((await accept(old)).status).toBe(404);
    expect((await accept(fresh)).status).toBe(201);
  });

  it("a revoked invitation's link stops working and it leaves the list", async () => {
    const { id, token } = await inviteAndRead("revoked@example.com", "coach");
    const revoked = await call(invitationRoute.DELETE, { method: "DELETE", params: { invitationId: `${id}` } });
    expect(revoked.status).toBe(200);
    expect((await accept(token)).status).toBe(404);
    const list = await call(invitationsRoute.GET);
    expect(list.json.invitations.map((i: { id: number }) => i.id)).not.toContain(id);
    expect((await call(invitationRoute.DELETE, { method: "DELETE", params: { invitationId: `${id}` } })).status).toBe(
      404,
    );
  });

  it("expires after 7 days (410), and can then be sent again", async () => {
    const { id, token } = await inviteAndRead("late@example.com", "coach");
    const [row] = await env.db.select().from(invitations).where(eq(invitations.id, id));
    const days = (row.expiresAt.getTime() - row.createdAt.getTime()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThan(7.01);
    await env.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, id));
    const late = await accept(token);
    expect(late.status).toBe(410);
    expect(late.json.error.message).toMatch(/expired/);
    // Expired, so a new invitation to the address is allowed and replaces it.
    const again = await inviteAndRead("late@example.com", "coach");
    expect((await accept(again.token)).status).toBe(201);
  });

  it("a malformed token is 422, never a 500", async () => {
    for (const token of ["", "short", "x".repeat(43).replace("x", "/"), 42, null]) {
      expect(
        (await call(acceptRoute.POST, { method: "POST", body: { token, name: "A", password: "long-enough-pw" } }))
          .status,
      ).toBe(422);
    }
    const weak = await call(acceptRoute.POST, {
      method: "POST",
      body: { token: "a".repeat(43), name: "A", password: "short" },
    });
    expect(weak.status).toBe(422);
    expect(weak.json.error.fields.password).toMatch(/at least 10/);
  });
});

describe("members", () => {
  it("lists members with roles, coaches' squads and linked athletes", async () => {
    await signInAs("owner@example.com");
    const { status, json } = await call(membersRoute.GET);
    expect(status).toBe(200);
    const byEmail = Object.fromEntries(json.members.map((m: { email: string }) => [m.email, m]));
    expect(byEmail["owner@example.com"]).toMatchObject({ role: "owner", lastOwner: true, isYou: true });
    expect(byEmail["coach@example.com"].squads.map((s: { name: string }) => s.name)).toEqual(["Academy U18"]);
    expect(byEmail["athlete@example.com"].athlete.name).toBe("Tessa Lindqvist");
    expect(byEmail["owner@other.example.com"]).toBeUndefined();
  });

  it("the last owner can be neither demoted nor removed", async () => {
    await signInAs("owner@example.com");
    const owner = `${await userIdOf("owner@example.com")}`;
    const demote = await call(memberRoute.PATCH, {
      method: "PATCH",
      params: { userId: owner },
      body: { role: "coach" },
    });
    expect(demote.status).toBe(409);
    expect(demote.json.error.message).toMatch(/only owner/);
    expect((await call(memberRoute.DELETE, { method: "DELETE", params: { userId: owner } })).status).toBe(409);
  });

  it("changes roles; a coach who stops coaching leaves their squads; athletes stay athletes", async () => {
    await signInAs("owner@example.com");
    const coach = `${await userIdOf("coach@example.com")}`;
    const changed = await call(memberRoute.PATCH, {
      method: "PATCH",
      params: { userId: coach },
      body: { role: "scientist" },
    });
    expect(changed.status).toBe(200);
    expect(changed.json.member).toMatchObject({ role: "scientist", squads: [] });
    const back = await call(memberRoute.PATCH, { method: "PATCH", params: { userId: coach }, body: { role: "coach" } });
    expect(back.json.member).toMatchObject({ role: "coach", squads: [] });
    const athlete = `${await userIdOf("athlete2@example.com")}`;
    const toStaff = await call(memberRoute.PATCH, {
      method: "PATCH",
      params: { userId: athlete },
      body: { role: "coach" },
    });
    expect(toStaff.status).toBe(422);
    expect(
      (await call(memberRoute.PATCH, { method: "PATCH", params: { userId: coach }, body: { role: "boss" } })).status,
    ).toBe(422);
  });

  it("with a second owner, the first may step down; removal ends the member's sessions at once", async () => {
    await signInAs("owner@example.com");
    const scientist = `${await userIdOf("scientist@example.com")}`;
    expect(
      (await call(memberRoute.PATCH, { method: "PATCH", params: { userId: scientist }, body: { role: "owner" } }))
        .status,
    ).toBe(200);
    // The removed member holds a session, as a signed-in browser would.
    await signInAs("coach2@example.com");
    expect((await call(meRoute.GET)).status).toBe(200);
    const held = { ...(await import("../helpers/session")).signedIn };
    await signInAs("owner@example.com");
    const coach2 = await userIdOf("coach2@example.com");
    const removed = await call(memberRoute.DELETE, { method: "DELETE", params: { userId: `${coach2}` } });
    expect(removed.status).toBe(200);
    expect(await env.db.select().from(memberships).where(eq(memberships.userId, coach2))).toEqual([]);
    const session = (await import("../helpers/session")).signedIn;
    Object.assign(session, held);
    expect((await call(meRoute.GET)).status).toBe(401);
    // Two owners now: the first owner may become a scientist.
    await signInAs("owner@example.com");
    const owner = `${await userIdOf("owner@example.com")}`;
    expect(
      (await call(memberRoute.PATCH, { method: "PATCH", params: { userId: owner }, body: { role: "scientist" } }))
        .status,
    ).toBe(200);
  });

  it("members of another organisation are not found", async () => {
    await signInAs("scientist@example.com"); // an owner since the test above
    const other = `${await userIdOf("owner@other.example.com")}`;
    expect((await call(memberRoute.GET, { params: { userId: other } })).status).toBe(404);
    expect(
      (await call(memberRoute.PATCH, { method: "PATCH", params: { userId: other }, body: { role: "coach" } })).status,
    ).toBe(404);
    expect((await call(memberRoute.DELETE, { method: "DELETE", params: { userId: other } })).status).toBe(404);
  });
});

describe("deletion requests", () => {
  it("an athlete asks once (201), asking again answers 200 with the same request; owners get a mail", async () => {
    await signInAs("athlete2@example.com");
    const first = await call(deletionRequestRoute.POST, {
      method: "POST",
      body: { message: "I have left the club." },
    });
    expect(first.status).toBe(201);
    const again = await call(deletionRequestRoute.POST, { method: "POST", body: {} });
    expect(again.status).toBe(200);
    expect(again.json.request.id).toBe(first.json.request.id);
    expect(await env.db.select().from(deletionRequests)).toHaveLength(1);
    const owners = (await mailbox.messages()).filter((m) => m.subject.startsWith("Deletion request from"));
    // Owners at the time: the demo owner stepped down, the scientist became one.
    expect(owners.map((m) => m.to)).toEqual(["scientist@example.com"]);
    expect(owners[0].text).toContain("I have left the club.");
    await signInAs("scientist@example.com");
    const pending = await call(deletionRequestsRoute.GET);
    expect(pending.json.requests).toMatchObject([{ athleteName: "Priya Damaschke", message: "I have left the club." }]);
  });

  it("staff cannot ask; an over-long message is 422", async () => {
    await signInAs("coach@example.com");
    expect((await call(deletionRequestRoute.POST, { method: "POST", body: {} })).status).toBe(403);
    await signInAs("athlete@example.com");
    expect(
      (await call(deletionRequestRoute.POST, { method: "POST", body: { message: "x".repeat(1001) } })).status,
    ).toBe(422);
  });
});

describe("tokens stay secret", () => {
  it("no token appears in the database (audit entries included) or on the console", async () => {
    expect(tokensSeen.length).toBeGreaterThan(5);
    const { rows: tables } = await getClient().execute(
      "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'",
    );
    const dump: string[] = [];
    for (const t of tables) {
      const { rows } = await getClient().execute(`SELECT * FROM "${String(t.name)}"`);
      for (const row of rows) dump.push(JSON.stringify(row, (_k, v) => (typeof v === "bigint" ? String(v) : v)));
    }
    const everything = dump.join("\n");
    const audit = JSON.stringify(await env.db.select().from(auditEvents));
    for (const token of tokensSeen) {
      expect(everything.includes(token)).toBe(false);
      expect(audit.includes(token)).toBe(false);
      expect(audit.includes(sha256(token))).toBe(false);
      expect(consoleLines.some((line) => line.includes(token))).toBe(false);
    }
    expect(await env.db.select().from(users).where(eq(users.email, "new.coach@example.com"))).toEqual([]);
  });
});
