import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes, squads, testingSessions, tests } from "@/db/schema";
import type { Actor } from "./actors";
import { athleteScope, sessionScope, squadScope } from "./scope";

export async function squadInReach(actor: Actor, squadId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: squads.id })
    .from(squads)
    .where(and(eq(squads.id, squadId), squadScope(actor)))
    .limit(1);
  return rows.length > 0;
}

export async function athleteInReach(actor: Actor, athleteId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: athletes.id })
    .from(athletes)
    .where(and(eq(athletes.id, athleteId), athleteScope(actor)))
    .limit(1);
  return rows.length > 0;
}

export async function sessionInReach(actor: Actor, sessionId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: testingSessions.id })
    .from(testingSessions)
    .where(and(eq(testingSessions.id, sessionId), sessionScope(actor)))
    .limit(1);
  return rows.length > 0;
}

/** Every member of the organisation may read its test library. */
export async function testInReach(actor: Actor, testId: number): Promise<boolean> {
  const rows = await getDb()
    .select({ id: tests.id })
    .from(tests)
    .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)))
    .limit(1);
  return rows.length > 0;
}
