/**
 * Import: the database side. Reads the session, its battery and roster for checking a file,
 * and commits a checked file in ONE transaction (results, the raw upload, one audit event),
 * so a failure anywhere leaves the session exactly as it was.
 */
import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { getDb, type Reader, type Transaction as Tx, writeTransaction } from "@/db/client";
import { athletes, results, squads, testingSessions, tests, uploads } from "@/db/schema";
import { aliasKey } from "@/lib/aliases";
import { canEditSession } from "@/lib/auth/permissions";
import type { Phase, SessionStatus } from "@/lib/domain";
import { ApiError, forbidden, invalidInput } from "@/lib/errors";
import { type Analysis, analyseCsvInSlices } from "@/lib/import/analyse";
import { runInSlices } from "@/lib/import/cooperative";
import { decodeSteps, ImportFileError } from "@/lib/import/decode";
import {
  MAX_IMPORT_BYTES,
  MAX_LISTED_REPLACEMENTS,
  MAX_SHOWN_CHARS,
  PREVIEW_ROWS,
  TOO_LARGE_MESSAGE,
} from "@/lib/import/limits";
import { applyMatches, hasMatches, NO_MATCHES, namesInFile, usedMatches } from "@/lib/import/matches";
import { planWrites, type ResultWrite, resultKey } from "@/lib/import/merge";
import { describeReplacements, type ImportCommitted, type ImportPreview } from "@/lib/import/summary";
import type { ExistingResult, ImportContext } from "@/lib/import/types";
import { type ImportOptions, mappingRequestOf } from "@/lib/validation/import";
import type { Actor } from "./actors";
import { rememberMatches } from "./aliases";
import { recordAudit } from "./audit";
import { findSessionInScope, onSessionSheet } from "./scope";
import { sessionBattery } from "./sessions";
import { suspectsAmong } from "./suspects";

export type ImportSession = {
  id: number;
  organizationId: number;
  squadId: number;
  squadName: string;
  date: string;
  phase: Phase;
  status: SessionStatus;
  /** Coaches import into draft sessions; a published session is changed by a scientist or the owner. */
  canImport: boolean;
};

export type ImportFile = { bytes: Uint8Array; filename: string; contentType: string | null };

export async function getImportSession(actor: Actor, sessionId: number): Promise<ImportSession> {
  const row = await findSessionInScope(getDb(), actor, sessionId, {
    id: testingSessions.id,
    organizationId: testingSessions.organizationId,
    squadId: testingSessions.squadId,
    squadName: squads.name,
    date: testingSessions.date,
    phase: testingSessions.phase,
    status: testingSessions.status,
  });
  return { ...row, canImport: canEditSession(actor, row.status) };
}

/** Battery, the rest of the organisation's Test library (names only) and the squad roster. */
export async function loadImportContext(session: ImportSession, db: Reader = getDb()): Promise<ImportContext> {
  const [battery, allTests, roster] = await Promise.all([
    sessionBattery(session.id, db),
    db
      .select({ id: tests.id, name: tests.name, aliases: tests.aliases })
      .from(tests)
      .where(eq(tests.organizationId, session.organizationId)),
    // The same athletes the Session sheet takes scores for (lib/data/scope.ts, onSessionSheet).
    db
      .select({
        id: athletes.id,
        name: athletes.name,
        externalId: athletes.externalId,
        aliases: athletes.aliases,
        position: athletes.position,
      })
      .from(athletes)
      .where(and(eq(athletes.organizationId, session.organizationId), onSessionSheet(session)))
      .orderBy(asc(athletes.name)),
  ]);
  const aliasesOf = new Map(allTests.map((t) => [t.id, t.aliases]));
  const inBattery = new Set(battery.map((t) => t.id));
  const others = allTests.filter((t) => !inBattery.has(t.id));
  return {
    squadName: session.squadName,
    tests: battery.map((t) => ({ ...t, aliases: aliasesOf.get(t.id) ?? [] })),
    otherTestNames: others.flatMap((t) => [t.name, ...t.aliases]),
    athletes: roster,
  };
}

/**
 * The roster as the mapping step offers it: where two athletes share a name, each is told apart
 * by position and external id, so a coach picks the right one.
 */
function rosterChoices(context: ImportContext) {
  const named = new Map<string, number>();
  for (const a of context.athletes) named.set(aliasKey(a.name), (named.get(aliasKey(a.name)) ?? 0) + 1);
  return context.athletes.map((a) => ({
    id: a.id,
    name:
      (named.get(aliasKey(a.name)) ?? 0) > 1
        ? `${a.name} (${[a.position, a.externalId ?? "no external id"].filter(Boolean).join(", ")})`
        : a.name,
  }));
}

async function loadExisting(
  db: Reader,
  session: ImportSession,
): Promise<Map<string, ExistingResult & { value: number | null }>> {
  const rows = await db
    .select({
      athleteId: results.athleteId,
      testId: results.testId,
      trials: results.trials,
      value: results.value,
      flag: results.flag,
      version: results.version,
    })
    .from(results)
    .where(and(eq(results.sessionId, session.id), eq(results.organizationId, session.organizationId)));
  return new Map(
    rows.map((r) => [
      resultKey(r.athleteId, r.testId),
      { trials: r.trials ?? [], value: r.value, flag: r.flag, version: r.version },
    ]),
  );
}

async function decode(bytes: Uint8Array): Promise<string> {
  if (bytes.length > MAX_IMPORT_BYTES) throw new ApiError(413, "payload_too_large", TOO_LARGE_MESSAGE);
  try {
    return await runInSlices(decodeSteps(bytes));
  } catch (error) {
    if (error instanceof ImportFileError) throw new ApiError(error.status, error.code, error.message);
    throw error;
  }
}

const clip = (cell: string) => (cell.length > MAX_SHOWN_CHARS ? `${cell.slice(0, MAX_SHOWN_CHARS)}…` : cell);

const testsMap = (context: ImportContext) => new Map(context.tests.map((t) => [t.id, t]));

/** Checks a file (preview) or checks and writes it (commit). */
export async function runImport(
  actor: Actor,
  sessionId: number,
  file: ImportFile,
  options: ImportOptions,
): Promise<ImportPreview | ImportCommitted> {
  const session = await getImportSession(actor, sessionId);
  if (!session.canImport)
    throw forbidden("This session is published; a sport scientist or the owner can import into it.");
  const text = await decode(file.bytes);
  const matches = options.matches ?? NO_MATCHES;
  const { context, problems } = applyMatches(await loadImportContext(session), matches);
  if (problems.length > 0)
    throw invalidInput(`${problems.join(" ")} Choose the match again.`, { matches: problems[0] });
  const analysis = await analyseCsvInSlices(text, mappingRequestOf(options), context);
  if (options.mode === "preview") return preview(session, context, analysis, file);
  const { plan, table } = analysis;
  if (plan.errorCount > 0) {
    const unlisted = plan.errorCount - plan.errors.length;
    const listed = unlisted > 0 ? ` (the first ${plan.errors.length} are listed; ${unlisted} more are not)` : "";
    throw new ApiError(
      422,
      "invalid_input",
      `${plan.errorCount} ${plan.errorCount === 1 ? "problem" : "problems"} in the file${listed}. Nothing was imported.`,
      {
        rows: plan.errors,
        details: {
          errorCount: plan.errorCount,
          unknownAthletes: plan.unknownAthletes,
          unknownAthleteCount: plan.unknownAthleteCount,
          unknownTests: plan.unknownTests,
        },
      },
    );
  }
  if (plan.valueCount === 0) {
    throw new ApiError(
      422,
      "invalid_input",
      "The file holds no scores: every score cell is empty. Nothing was imported.",
      {
        rows: [{ row: table.headerRow + 1, message: "No scores below the header." }],
      },
    );
  }
  return commitImport(actor, session, context, analysis, file, {
    replace: options.replace,
    // The file is read for its names only when there is a match to remember.
    remember:
      options.remember && hasMatches(matches)
        ? usedMatches(matches, namesInFile(table, analysis.resolved.mapping))
        : null,
  });
}

async function preview(
  session: ImportSession,
  context: ImportContext,
  analysis: Analysis,
  file: ImportFile,
): Promise<ImportPreview> {
  const { table, resolved, plan } = analysis;
  const existing = await loadExisting(getDb(), session);
  const writes = planWrites(plan.groups, existing, testsMap(context), plan.columnOf);
  const width = table.headers.length;
  const suspects = await suspectsAmong(
    session.organizationId,
    session.id,
    writes.writes.map((w) => ({ ...w, flag: null })),
  );
  return {
    mode: "preview",
    suspects,
    file: { name: file.filename, size: file.bytes.length },
    format: resolved.mapping.format,
    detectedFormat: resolved.detectedFormat,
    delimiter: table.delimiter,
    decimalComma: table.delimiter !== ",",
    headers: table.headers,
    headerRow: table.headerRow,
    mapping: resolved.mapping,
    suggestions: resolved.suggestions,
    longColumns: resolved.suggestedLong,
    rowCount: plan.rowCount,
    sample: table.rows.slice(0, PREVIEW_ROWS).map((cells, i) => ({
      row: table.rowNumbers[i],
      cells: Array.from({ length: Math.max(width, cells.length) }, (_, c) => clip(cells[c] ?? "")),
    })),
    parsed: plan.sample,
    unknownAthletes: plan.unknownAthletes,
    unknownAthleteCount: plan.unknownAthleteCount,
    unknownTests: plan.unknownTests,
    leftOut: plan.leftOut,
    errors: plan.errors,
    errorCount: plan.errorCount,
    warnings: plan.warnings,
    warningCount: plan.warningCount,
    counts: writes.counts,
    replacements: describeReplacements(writes.replacements, context, MAX_LISTED_REPLACEMENTS),
    canCommit: plan.errorCount === 0 && plan.valueCount > 0,
    tests: context.tests.map((t) => ({
      id: t.id,
      name: t.name,
      unit: t.unit,
      decimals: t.decimals,
      trialsPerSession: t.trialsPerSession,
    })),
    roster: rosterChoices(context),
  };
}

/** Rows per statement: each batch is one JSON parameter, so SQLite's variable limit never applies. */
const UPSERT_BATCH = 5000;

/**
 * Writes the results in batches of INSERT … SELECT FROM json_each(?) … ON CONFLICT DO UPDATE.
 * One bound JSON array per batch instead of ten placeholders per row: the SQL text stays short
 * and building it costs nothing (drizzle's builder spends ~40 µs a row on a multi-row VALUES list,
 * five times the cost of the insert itself at 34 000 rows). json_each: SQLite JSON1, built in
 * since 3.38 and in libSQL.
 */
async function upsertResults(tx: Tx, session: ImportSession, writes: ResultWrite[], userId: number, at: Date) {
  const now = at.getTime();
  for (let i = 0; i < writes.length; i += UPSERT_BATCH) {
    const end = Math.min(writes.length, i + UPSERT_BATCH);
    const parts: string[] = new Array(end - i);
    for (let k = i; k < end; k++) {
      const w = writes[k];
      parts[k - i] = `[${w.athleteId},${w.testId},${JSON.stringify(w.trials)},${w.value === null ? "null" : w.value}]`;
    }
    await tx.run(sql`
      INSERT INTO results (organization_id, session_id, athlete_id, test_id, trials, value, flag, updated_by, updated_at, version)
      SELECT ${session.organizationId}, ${session.id}, json_extract(j.value, '$[0]'), json_extract(j.value, '$[1]'),
             json_extract(j.value, '$[2]'), json_extract(j.value, '$[3]'), NULL, ${userId}, ${now}, 1
      FROM json_each(${`[${parts.join(",")}]`}) AS j
      WHERE true -- SQLite's UPSERT docs: an INSERT … SELECT needs a WHERE before ON CONFLICT ("parsing ambiguity")
      ON CONFLICT (session_id, athlete_id, test_id) DO UPDATE SET
        trials = excluded.trials,
        value = excluded.value,
        flag = excluded.flag,
        updated_by = excluded.updated_by,
        updated_at = excluded.updated_at,
        -- A new version makes every open Session sheet's copy stale: its next save gets a 409.
        version = results.version + 1`);
  }
}

async function commitImport(
  actor: Actor,
  session: ImportSession,
  context: ImportContext,
  analysis: Analysis,
  file: ImportFile,
  { replace, remember }: { replace: boolean; remember: ReturnType<typeof usedMatches> | null },
): Promise<ImportCommitted> {
  const { plan } = analysis;
  const rowsImported = plan.rowsWithValues;
  const filename = (file.filename || "upload.csv").slice(0, 255);
  const { committed, written } = await writeTransaction(async (tx) => {
    // Read inside the transaction: what is merged is what is there at this moment.
    const existing = await loadExisting(tx, session);
    const { writes, replacements, counts } = planWrites(plan.groups, existing, testsMap(context), plan.columnOf);
    if (replacements.length > 0 && !replace) {
      const rows = describeReplacements(replacements, context, MAX_LISTED_REPLACEMENTS);
      throw new ApiError(
        409,
        "conflict",
        `${replacements.length} stored ${replacements.length === 1 ? "value" : "values"} would be replaced. Nothing was imported; send replace=yes to replace them.`,
        { rows, details: { replacements: rows, trialsReplaced: replacements.length } },
      );
    }
    const [upload] = await tx
      .insert(uploads)
      .values({
        organizationId: session.organizationId,
        sessionId: session.id,
        filename,
        sizeBytes: file.bytes.length,
        contentType: file.contentType?.slice(0, 200) || null,
        content: Buffer.from(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength),
        format: plan.format,
        rowsImported,
        createdBy: actor.userId,
      })
      .returning({ id: uploads.id });
    await upsertResults(tx, session, writes, actor.userId, new Date());
    const names = await rememberMatches(tx, actor, remember?.used ?? NO_MATCHES);
    for (const { kind, value } of remember?.absent ?? [])
      names.unremembered.push({ kind, value, reason: "the file does not use this name" });
    const before = writes
      .filter((w) => !w.isNew)
      .map((w) => {
        const old = existing.get(resultKey(w.athleteId, w.testId))!;
        return { athleteId: w.athleteId, testId: w.testId, trials: old.trials, value: old.value, flag: old.flag };
      });
    await recordAudit(tx, actor, {
      action: "results.import",
      entity: { type: "upload", id: upload.id },
      sessionId: session.id,
      // The results as they were, so the import can be reviewed (or undone) later.
      before: before.length ? { results: before } : null,
      after: {
        uploadId: upload.id,
        filename,
        format: plan.format,
        rows: rowsImported,
        replace,
        ...counts,
        ...(names.remembered.length ? { remembered: names.remembered } : {}),
        ...(plan.leftOut.length ? { leftOut: plan.leftOut } : {}),
      },
    });
    return {
      committed: {
        mode: "commit" as const,
        uploadId: upload.id,
        filename,
        format: plan.format,
        rowsImported,
        counts,
        leftOut: plan.leftOut,
        ...names,
      },
      written: writes,
    };
  });
  // After the commit: the typo guard reads earlier published sessions, not this write.
  const suspects = await suspectsAmong(
    session.organizationId,
    session.id,
    written.map((w) => ({ ...w, flag: null })),
  );
  return { ...committed, suspects };
}
