/**
 * What to look at before publishing: scores the typo guard doubts and cells still empty, each by
 * athlete with names, so the publish dialog can list them (a count alone says nothing useful).
 */
import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Reader } from "@/db/client";
import { athletes, sessionTests, tests } from "@/db/schema";
import type { Actor } from "./actors";
import { listResultRows } from "./results";
import { onSessionSheet } from "./scope";
import { suspectsAmong } from "./suspects";

/** The caller has checked the session is in reach. */
export async function scoreCheck(reader: Reader, actor: Actor, session: { id: number; squadId: number }) {
  const [battery, rows, onSheet] = await Promise.all([
    // Read here rather than through sessions.ts, which imports the publishing code that imports this.
    reader
      .select({
        id: tests.id,
        name: tests.name,
        unit: tests.unit,
        decimals: tests.decimals,
        trialsPerSession: tests.trialsPerSession,
      })
      .from(sessionTests)
      .innerJoin(tests, eq(tests.id, sessionTests.testId))
      .where(eq(sessionTests.sessionId, session.id))
      .orderBy(asc(sessionTests.position)),
    listResultRows(reader, actor, session.id),
    reader
      .select({ id: athletes.id, name: athletes.name })
      .from(athletes)
      .where(
        and(eq(athletes.organizationId, actor.organizationId), onSessionSheet(session, { activeMembersOnly: true })),
      )
      .orderBy(asc(athletes.name)),
  ]);
  const suspects = await suspectsAmong(actor.organizationId, session.id, rows);
  const testById = new Map(battery.map((t) => [t.id, t]));
  const rowOf = new Map(rows.map((r) => [`${r.athleteId}:${r.testId}`, r]));
  const missing = onSheet
    .map((a) => ({
      athleteId: a.id,
      name: a.name,
      tests: battery
        .filter((t) => {
          const row = rowOf.get(`${a.id}:${t.id}`);
          return !row || (row.value === null && row.flag === null);
        })
        .map((t) => t.name),
    }))
    .filter((a) => a.tests.length > 0);
  const nameOf = new Map(onSheet.map((a) => [a.id, a.name]));
  return {
    missing,
    suspects: suspects.map((s) => {
      const test = testById.get(s.testId)!;
      return {
        ...s,
        athleteName: nameOf.get(s.athleteId) ?? "",
        test: { name: test.name, unit: test.unit, decimals: test.decimals, trialsPerSession: test.trialsPerSession },
      };
    }),
  };
}
