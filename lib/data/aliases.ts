/**
 * Remembering the Import's matches: "Luca Dempsy" is Luca Dempsey, "CMJ" is the countermovement
 * jump, from the next file on. Written in the import's own transaction, so a refused import
 * remembers nothing.
 */
import "server-only";
import { and, eq } from "drizzle-orm";
import type { Transaction } from "@/db/client";
import { athletes, tests } from "@/db/schema";
import { aliasClash, aliasKey, cleanAliases, type Named } from "@/lib/aliases";
import { canEditRoster, canEditTestLibrary } from "@/lib/auth/permissions";
import type { ImportCommitted } from "@/lib/import/summary";
import type { ImportMatches } from "@/lib/import/types";
import { ALIAS_CHARS, cleanText, hasVisibleText, MAX_ALIASES } from "@/lib/validation/common";
import type { Actor } from "./actors";

type Outcome = Pick<ImportCommitted, "remembered" | "unremembered">;

/** Decides, for one kind, which matches become other names, and the new alias lists by id. */
function plan(
  kind: "athlete" | "test",
  matches: Record<string, number>,
  everyone: Named[],
  outcome: Outcome,
  /** Further names that are taken (athletes' external ids). */
  taken: Named[] = [],
) {
  const byId = new Map(everyone.map((e) => [e.id, { ...e, aliases: [...e.aliases] }]));
  const changed = new Set<number>();
  for (const [raw, id] of Object.entries(matches)) {
    const value = cleanText(raw).replace(/\s+/g, " ");
    const owner = byId.get(id);
    if (!owner || aliasKey(value) === "") continue;
    if (aliasKey(value) === aliasKey(owner.name)) {
      // Only a name two share needs matching to its own owner: as another name it would settle nothing.
      outcome.unremembered.push({
        kind,
        value: raw,
        reason: `more than one is called “${value}”; match it in each file`,
      });
      continue;
    }
    // The rules of the Test library and Roster forms (lib/validation/common.ts, aliasList).
    if (value.length > ALIAS_CHARS || !hasVisibleText(value)) {
      outcome.unremembered.push({
        kind,
        value: raw,
        reason: `another name is kept only with 1 to ${ALIAS_CHARS} visible characters`,
      });
      continue;
    }
    if (owner.aliases.some((a) => aliasKey(a) === aliasKey(value))) continue;
    // A name that already belongs to someone else stays a one-off match: remembered, it would make
    // every later file ambiguous.
    const clash = aliasClash([value], id, [...byId.values(), ...taken]);
    if (clash) {
      outcome.unremembered.push({ kind, value, reason: `“${value}” already names ${clash.owner}` });
      continue;
    }
    if (owner.aliases.length >= MAX_ALIASES) {
      outcome.unremembered.push({ kind, value, reason: `${owner.name} already has ${MAX_ALIASES} other names` });
      continue;
    }
    owner.aliases = cleanAliases([...owner.aliases, value], owner.name);
    changed.add(id);
    outcome.remembered.push({ kind, value, id, name: owner.name });
  }
  return [...changed].map((id) => ({ id, aliases: byId.get(id)!.aliases }));
}

/**
 * Every athlete of the organisation with their name and other names, and their external ids as
 * names taken too: the Import reads an external id before any name, so another name equal to one
 * would never be reached. For checking a new other name against all of them.
 */
export async function athleteNames(tx: Transaction, organizationId: number) {
  const everyone = await tx
    .select({ id: athletes.id, name: athletes.name, aliases: athletes.aliases, externalId: athletes.externalId })
    .from(athletes)
    .where(eq(athletes.organizationId, organizationId));
  const externalIds: Named[] = everyone.flatMap((a) =>
    a.externalId ? [{ id: a.id, name: a.name, aliases: [a.externalId] }] : [],
  );
  return { everyone, externalIds };
}

/** Stores each match as another name of its athlete or test, unless the name is taken. */
export async function rememberMatches(tx: Transaction, actor: Actor, asked: ImportMatches): Promise<Outcome> {
  const { organizationId } = actor;
  const outcome: Outcome = { remembered: [], unremembered: [] };
  let matches = asked;
  if (!canEditTestLibrary(actor)) {
    // A coach's match serves this import; the Test library is the owner's and the scientists'.
    for (const value of Object.keys(matches.tests))
      outcome.unremembered.push({
        kind: "test",
        value,
        reason: "other names of tests are added by the owner or a sport scientist, in the Test library",
      });
    matches = { ...matches, tests: {} };
  }
  if (canEditRoster(actor) && Object.keys(matches.athletes).length > 0) {
    // Every athlete of the organisation: a remembered name must not clash with anyone's, on any squad.
    const { everyone, externalIds } = await athleteNames(tx, organizationId);
    for (const { id, aliases } of plan("athlete", matches.athletes, everyone, outcome, externalIds))
      await tx
        .update(athletes)
        .set({ aliases })
        .where(and(eq(athletes.id, id), eq(athletes.organizationId, organizationId)));
  }
  if (Object.keys(matches.tests).length > 0) {
    const everyone = await tx
      .select({ id: tests.id, name: tests.name, aliases: tests.aliases, version: tests.version })
      .from(tests)
      .where(eq(tests.organizationId, organizationId));
    const versions = new Map(everyone.map((t) => [t.id, t.version]));
    const updates = plan("test", matches.tests, everyone, outcome);
    // A new version: a Test library form opened before this import must reload before saving over it.
    for (const { id, aliases } of updates)
      await tx
        .update(tests)
        .set({ aliases, version: versions.get(id)! + 1 })
        .where(and(eq(tests.id, id), eq(tests.organizationId, organizationId)));
  }
  return outcome;
}
