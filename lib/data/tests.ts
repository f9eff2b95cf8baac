import "server-only";
import { and, asc, count, eq } from "drizzle-orm";
import { getDb, type Transaction, writeTransaction } from "@/db/client";
import { results, sessionTests, tests } from "@/db/schema";
import { aliasClash, aliasKey, cleanAliases } from "@/lib/aliases";
import { canSeeResultCounts } from "@/lib/auth/permissions";
import { ApiError, conflict, notFound } from "@/lib/errors";
import type { TestCreateInput, TestUpdateInput } from "@/lib/validation/tests";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { isUniqueViolation } from "./errors";
import { type CurrentSwc, currentSwcByTest } from "./test-swc";

export const testColumns = {
  id: tests.id,
  name: tests.name,
  unit: tests.unit,
  decimals: tests.decimals,
  direction: tests.direction,
  trialRule: tests.trialRule,
  trialsPerSession: tests.trialsPerSession,
  swcMethod: tests.swcMethod,
  swcValue: tests.swcValue,
  cvPercent: tests.cvPercent,
  typicalError: tests.typicalError,
  typicalErrorDf: tests.typicalErrorDf,
  typicalErrorSource: tests.typicalErrorSource,
  plausibleMin: tests.plausibleMin,
  plausibleMax: tests.plausibleMax,
  aliases: tests.aliases,
  archived: tests.archived,
  version: tests.version,
};

const nameTaken = (name: string) => conflict(`A test called "${name}" already exists in your library.`);

/**
 * A test's name and other names must each read as one test only: the Import could not tell
 * two tests apart otherwise. Returns the aliases as stored.
 */
async function checkNames(
  tx: Transaction,
  organizationId: number,
  test: { id: number | null; name: string; aliases: readonly string[] },
): Promise<string[]> {
  const aliases = cleanAliases(test.aliases, test.name);
  const others = await tx
    .select({ id: tests.id, name: tests.name, aliases: tests.aliases })
    .from(tests)
    .where(eq(tests.organizationId, organizationId));
  // The name against other tests' names is the unique index's job (a clearer 409 there).
  const aliasOwner = others.find((o) => o.id !== test.id && o.aliases.some((a) => aliasKey(a) === aliasKey(test.name)));
  if (aliasOwner) throw conflict(`“${test.name}” is another name of ${aliasOwner.name}. Remove it there first.`);
  const clash = aliasClash(aliases, test.id, others);
  if (clash) {
    throw new ApiError(
      409,
      "conflict",
      `“${clash.name}” is taken: it reads as ${clash.owner}, and a file could not tell the two apart.`,
      {
        fields: { aliases: `“${clash.name}” reads as ${clash.owner}; choose another name.` },
      },
    );
  }
  return aliases;
}

/**
 * A Test library row; for staff only, `resultCount` (results across the organisation) and
 * `currentSwc` (the SWC in the test's unit from the latest baseline scores they reach).
 */
export type TestListItem = Awaited<ReturnType<typeof getTest>> & { resultCount?: number; currentSwc?: CurrentSwc };

export async function listTests(actor: Actor, { includeArchived = false } = {}): Promise<TestListItem[]> {
  const db = getDb();
  const where = includeArchived
    ? eq(tests.organizationId, actor.organizationId)
    : and(eq(tests.organizationId, actor.organizationId), eq(tests.archived, false));
  const rows = await db.select(testColumns).from(tests).where(where).orderBy(asc(tests.name));
  // The counts are about every athlete's results; an athlete learns nothing of the others.
  if (!canSeeResultCounts(actor)) return rows;
  const [counts, swcs] = await Promise.all([
    db
      .select({ testId: results.testId, n: count() })
      .from(results)
      .where(eq(results.organizationId, actor.organizationId))
      .groupBy(results.testId),
    currentSwcByTest(actor, rows),
  ]);
  const byTest = new Map(counts.map((c) => [c.testId, c.n]));
  return rows.map((r) => ({ ...r, resultCount: byTest.get(r.id) ?? 0, currentSwc: swcs.get(r.id) }));
}

export async function getTest(actor: Actor, testId: number) {
  const [row] = await getDb()
    .select(testColumns)
    .from(tests)
    .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)));
  if (!row) throw notFound("Test");
  return row;
}

export async function createTest(actor: Actor, input: TestCreateInput) {
  try {
    return await writeTransaction(async (tx) => {
      const aliases = await checkNames(tx, actor.organizationId, { id: null, ...input });
      const [row] = await tx
        .insert(tests)
        .values({ ...input, aliases, organizationId: actor.organizationId })
        .returning(testColumns);
      await recordAudit(tx, actor, { action: "test.create", entity: { type: "test", id: row.id }, after: row });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(input.name);
    throw error;
  }
}

/** Applies an edit only if nobody changed the test since `version` was read. */
export async function updateTest(actor: Actor, testId: number, input: TestUpdateInput) {
  const { version, ...changes } = input;
  try {
    return await writeTransaction(async (tx) => {
      const [before] = await tx
        .select(testColumns)
        .from(tests)
        .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)));
      if (!before) throw notFound("Test");
      if (before.version !== version) {
        throw conflict("Someone else changed this test since you opened it. Reload to see their change.", {
          current: before,
        });
      }
      const merged = { ...before, ...changes };
      if (merged.plausibleMin !== null && merged.plausibleMax !== null && merged.plausibleMin >= merged.plausibleMax) {
        throw conflict("The lowest plausible value must be below the highest.");
      }
      const aliases = await checkNames(tx, actor.organizationId, { ...merged, id: testId });
      const [row] = await tx
        .update(tests)
        .set({ ...changes, aliases, version: version + 1 })
        .where(and(eq(tests.id, testId), eq(tests.version, version)))
        .returning(testColumns);
      await recordAudit(tx, actor, { action: "test.update", entity: { type: "test", id: testId }, before, after: row });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(input.name ?? "");
    throw error;
  }
}

/** A test with results (or in a session's battery) is archived, never deleted. */
export async function deleteOrArchiveTest(
  actor: Actor,
  testId: number,
): Promise<{ deleted: true } | { archived: true }> {
  return writeTransaction(async (tx) => {
    const [test] = await tx
      .select({ id: tests.id, name: tests.name })
      .from(tests)
      .where(and(eq(tests.id, testId), eq(tests.organizationId, actor.organizationId)));
    if (!test) throw notFound("Test");
    const [used] = await tx.select({ n: count() }).from(results).where(eq(results.testId, testId));
    const [inBattery] = await tx.select({ n: count() }).from(sessionTests).where(eq(sessionTests.testId, testId));
    const entity = { type: "test", id: testId } as const;
    if ((used?.n ?? 0) > 0 || (inBattery?.n ?? 0) > 0) {
      await tx.update(tests).set({ archived: true }).where(eq(tests.id, testId));
      await recordAudit(tx, actor, { action: "test.archive", entity, before: test });
      return { archived: true as const };
    }
    await tx.delete(tests).where(eq(tests.id, testId));
    await recordAudit(tx, actor, { action: "test.delete", entity, before: test });
    return { deleted: true as const };
  });
}
