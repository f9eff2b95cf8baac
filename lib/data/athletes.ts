import "server-only";
import { and, asc, eq, inArray, notInArray } from "drizzle-orm";
import { getDb, type Transaction, writeTransaction } from "@/db/client";
import { athletes, squadAthletes, squads } from "@/db/schema";
import { aliasClash, cleanAliases } from "@/lib/aliases";
import { ApiError, conflict, invalidInput, notFound } from "@/lib/errors";
import type { AthleteCreateInput, AthleteUpdateInput, SquadAthleteAddInput } from "@/lib/validation/roster";
import type { Actor } from "./actors";
import { athleteNames } from "./aliases";
import { recordAudit } from "./audit";
import { isUniqueViolation } from "./errors";
import { athleteScope, squadScope } from "./scope";

const rosterColumns = {
  id: athletes.id,
  name: athletes.name,
  position: athletes.position,
  sex: athletes.sex,
  dateOfBirth: athletes.dateOfBirth,
  externalId: athletes.externalId,
  notes: athletes.notes,
  consentRecordedOn: athletes.consentRecordedOn,
  guardianConsentOn: athletes.guardianConsentOn,
  aliases: athletes.aliases,
  archived: athletes.archived,
};

/**
 * An athlete's other names, as stored (lib/aliases.ts), refused when one already belongs to
 * another athlete of the organisation — without saying whose: a coach may not reach them.
 */
async function checkedAliases(
  tx: Transaction,
  actor: Actor,
  athleteId: number | null,
  name: string,
  aliases: string[],
) {
  const cleaned = cleanAliases(aliases, name);
  if (cleaned.length === 0) return cleaned;
  const { everyone, externalIds } = await athleteNames(tx, actor.organizationId);
  const clash = aliasClash(cleaned, athleteId, [...everyone, ...externalIds]);
  if (clash) {
    const message = `“${clash.name}” is already the name, external id or another name of an athlete in your club; a file could not tell them apart.`;
    throw new ApiError(409, "conflict", message, { fields: { aliases: message } });
  }
  return cleaned;
}

/**
 * External ids are unique in the organisation, but a coach reaches only their squads: a clash
 * with an athlete they reach names that athlete; a clash outside their reach says only that the
 * id cannot be used, neither whose it is nor where.
 */
async function externalIdTaken(actor: Actor, externalId: string | null | undefined) {
  const [holder] = externalId
    ? await getDb()
        .select({ id: athletes.id, name: athletes.name })
        .from(athletes)
        .where(and(eq(athletes.externalId, externalId), athleteScope(actor)))
        .limit(1)
    : [];
  if (!holder) return conflict("That external id cannot be used. Choose another one.");
  return conflict(`${holder.name} already has the external id "${externalId}".`, { athleteId: holder.id });
}

/** The squad's athletes; the caller has the squad in reach (guard). */
export async function listSquadAthletes(actor: Actor, squadId: number, { includeArchived = false } = {}) {
  const conditions = [eq(squadAthletes.squadId, squadId), eq(athletes.organizationId, actor.organizationId)];
  if (!includeArchived) conditions.push(eq(athletes.archived, false));
  return getDb()
    .select(rosterColumns)
    .from(squadAthletes)
    .innerJoin(athletes, eq(athletes.id, squadAthletes.athleteId))
    .where(and(...conditions))
    .orderBy(asc(athletes.name));
}

export async function addAthleteToSquad(actor: Actor, squadId: number, input: SquadAthleteAddInput) {
  try {
    return await writeTransaction(async (tx) => {
      let athleteId: number;
      if ("athleteId" in input) {
        const [existing] = await tx
          .select({ id: athletes.id })
          .from(athletes)
          .where(and(eq(athletes.id, input.athleteId), athleteScope(actor)));
        if (!existing) throw notFound("Athlete");
        athleteId = existing.id;
      } else {
        const fresh = input as AthleteCreateInput;
        const aliases = await checkedAliases(tx, actor, null, fresh.name, fresh.aliases);
        const [created] = await tx
          .insert(athletes)
          .values({ ...fresh, aliases, organizationId: actor.organizationId })
          .returning({ id: athletes.id });
        athleteId = created.id;
      }
      await tx.insert(squadAthletes).values({ squadId, athleteId }).onConflictDoNothing();
      const [row] = await tx.select(rosterColumns).from(athletes).where(eq(athletes.id, athleteId));
      await recordAudit(tx, actor, {
        action: "roster.add",
        entity: { type: "athlete", id: athleteId },
        after: { ...row, squadId },
      });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw await externalIdTaken(actor, (input as AthleteCreateInput).externalId);
    throw error;
  }
}

/**
 * Edits an athlete. `squadIds` replaces the athlete's squads within the caller's reach:
 * a coach moves athletes between their own squads and never touches other squads' lists.
 */
export async function updateAthlete(actor: Actor, athleteId: number, input: AthleteUpdateInput) {
  const { squadIds, ...changes } = input;
  try {
    return await writeTransaction(async (tx) => {
      const [before] = await tx
        .select(rosterColumns)
        .from(athletes)
        .where(and(eq(athletes.id, athleteId), athleteScope(actor)));
      if (!before) throw notFound("Athlete");
      if (changes.aliases !== undefined || changes.name !== undefined)
        changes.aliases = await checkedAliases(
          tx,
          actor,
          athleteId,
          changes.name ?? before.name,
          changes.aliases ?? before.aliases,
        );
      if (Object.keys(changes).length > 0) await tx.update(athletes).set(changes).where(eq(athletes.id, athleteId));
      if (squadIds) {
        const reachable = (await tx.select({ id: squads.id }).from(squads).where(squadScope(actor))).map((s) => s.id);
        const wanted = [...new Set(squadIds)];
        if (wanted.some((id) => !reachable.includes(id))) {
          throw invalidInput("One of those squads is not yours to change.", { squadIds: "Unknown squad." });
        }
        const untouchable = reachable.length
          ? and(
              eq(squadAthletes.athleteId, athleteId),
              inArray(squadAthletes.squadId, reachable),
              notInArray(squadAthletes.squadId, wanted.length ? wanted : [0]),
            )
          : undefined;
        if (untouchable) await tx.delete(squadAthletes).where(untouchable);
        if (wanted.length)
          await tx
            .insert(squadAthletes)
            .values(wanted.map((squadId) => ({ squadId, athleteId })))
            .onConflictDoNothing();
      }
      const [row] = await tx.select(rosterColumns).from(athletes).where(eq(athletes.id, athleteId));
      await recordAudit(tx, actor, {
        action: "athlete.update",
        entity: { type: "athlete", id: athleteId },
        before,
        after: { ...row, squadIds },
      });
      return row;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw await externalIdTaken(actor, changes.externalId);
    throw error;
  }
}

/** One athlete with the squads (in the caller's reach) they belong to. */
export async function getAthlete(actor: Actor, athleteId: number) {
  const db = getDb();
  const [[row], squadRows] = await Promise.all([
    db
      .select(rosterColumns)
      .from(athletes)
      .where(and(eq(athletes.id, athleteId), athleteScope(actor))),
    // Scoped by the squad, so it reads nothing the caller could not reach on its own.
    db
      .select({ id: squadAthletes.squadId })
      .from(squadAthletes)
      .innerJoin(squads, eq(squads.id, squadAthletes.squadId))
      .where(and(eq(squadAthletes.athleteId, athleteId), squadScope(actor))),
  ]);
  if (!row) throw notFound("Athlete");
  return { ...row, squadIds: squadRows.map((r) => r.id) };
}

// Staff notes stay on the Roster: this list also answers athletes about themselves.
const { notes: _staffNotes, ...listColumns } = rosterColumns;

export type AthleteListItem = {
  id: number;
  name: string;
  position: string | null;
  sex: string | null;
  dateOfBirth: string | null;
  externalId: string | null;
  consentRecordedOn: string | null;
  guardianConsentOn: string | null;
  archived: boolean;
};

/** Athletes in the caller's reach: organisation, a coach's squads, or an athlete's own record. */
export async function listAthletes(actor: Actor, { includeArchived = false } = {}): Promise<AthleteListItem[]> {
  const where = includeArchived ? athleteScope(actor) : and(athleteScope(actor), eq(athletes.archived, false));
  return getDb().select(listColumns).from(athletes).where(where).orderBy(asc(athletes.name));
}
