import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { athletes } from "@/db/schema";
import type { Actor } from "./actors";
import { rosterColumns } from "./roster";
import { athleteScope } from "./scope";

// Staff notes stay on the Roster: this list also answers athletes about themselves.
const { notes: _staffNotes, ...listColumns } = rosterColumns;

export type AthleteListItem = {
  id: number;
  name: string;
  position: string | null;
  sex: string | null;
  dateOfBirth: string | null;
  externalId: string | null;
  archived: boolean;
};

/** Athletes in the caller's reach: organisation, a coach's squads, or an athlete's own record. */
export async function listAthletes(actor: Actor, { includeArchived = false } = {}): Promise<AthleteListItem[]> {
  const where = includeArchived ? athleteScope(actor) : and(athleteScope(actor), eq(athletes.archived, false));
  return getDb().select(listColumns).from(athletes).where(where).orderBy(asc(athletes.name));
}
