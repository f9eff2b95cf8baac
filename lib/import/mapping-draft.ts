import { aliasKey } from "@/lib/aliases";
import { parseTrialHeader } from "@/lib/import/columns";
import { hasMatches } from "@/lib/import/matches";
import type { ImportPreview } from "@/lib/import/summary";
import type { ImportFormat, ImportMatches, WideTarget } from "@/lib/import/types";

/**
 * A wide column in the mapping step: a test and trial, null when someone chose to ignore it, or
 * "unread" while nobody has — the server then reads it as its header suggests, or reports it.
 */
export type DraftTarget = WideTarget | "unread";

/** The mapping step's choices, in the shape the selects need. */
export type MappingDraft =
  | { format: "long"; athlete: string; test: string; trial: string; value: string }
  | { format: "wide"; athleteColumn: string; columns: Record<string, DraftTarget> };

export function draftFromPreview(preview: ImportPreview): MappingDraft {
  const m = preview.mapping;
  if (m.format === "long") {
    return {
      format: "long",
      athlete: m.columns.athlete ?? "",
      test: m.columns.test ?? "",
      trial: m.columns.trial ?? "",
      value: m.columns.value ?? "",
    };
  }
  const athleteColumn = m.athleteColumn ?? "";
  const columns: Record<string, DraftTarget> = {};
  for (const header of preview.headers)
    if (header !== athleteColumn && header !== "") columns[header] = header in m.columns ? m.columns[header] : "unread";
  return { format: "wide", athleteColumn, columns };
}

/** What the header suggests for a format the user switches to. */
export function defaultDraft(preview: ImportPreview, format: ImportFormat): MappingDraft {
  if (format === "long") {
    const c = preview.longColumns;
    return { format: "long", athlete: c.athlete ?? "", test: c.test ?? "", trial: c.trial ?? "", value: c.value ?? "" };
  }
  const athleteColumn = preview.suggestions.find((s) => s.status === "athlete")?.header ?? preview.headers[0] ?? "";
  const columns: Record<string, DraftTarget> = {};
  for (const s of preview.suggestions) {
    if (s.header === athleteColumn || s.header === "") continue;
    columns[s.header] =
      s.status === "matched" ? { testId: s.testId!, trial: s.trial! } : s.status === "ignored" ? null : "unread";
  }
  return { format: "wide", athleteColumn, columns };
}

export function withAthleteColumn(
  draft: Extract<MappingDraft, { format: "wide" }>,
  headers: string[],
  athleteColumn: string,
): MappingDraft {
  const columns: Record<string, DraftTarget> = {};
  for (const header of headers)
    if (header !== athleteColumn && header !== "") columns[header] = draft.columns[header] ?? "unread";
  return { format: "wide", athleteColumn, columns };
}

/** The multipart fields that carry a draft (the route reads the same names). */
export function fieldsOf(draft: MappingDraft): Record<string, string> {
  if (draft.format === "long") {
    return {
      format: "long",
      athleteColumn: draft.athlete,
      testColumn: draft.test,
      trialColumn: draft.trial,
      valueColumn: draft.value,
    };
  }
  // Columns nobody has read yet are left out: the server reads them as their header suggests.
  const chosen = Object.fromEntries(Object.entries(draft.columns).filter(([, target]) => target !== "unread"));
  return { format: "wide", athleteColumn: draft.athleteColumn, mapping: JSON.stringify(chosen) };
}

/** The matches with `name` left out of the import (or, `leave` false, taken back in). */
export function withLeftOut(matches: ImportMatches, kind: "athletes" | "tests", name: string, leave: boolean) {
  const leaveOut = { athletes: [...(matches.leaveOut?.athletes ?? [])], tests: [...(matches.leaveOut?.tests ?? [])] };
  leaveOut[kind] = leaveOut[kind].filter((n) => n !== name);
  if (leave) leaveOut[kind].push(name);
  return { ...matches, leaveOut };
}

/** The multipart field that carries the names matched in the mapping step (none: no field). */
export const matchFields = (matches: ImportMatches): Record<string, string> =>
  hasMatches(matches) ? { matches: JSON.stringify(matches) } : {};

/**
 * A wide file's columns after a test name was matched in the mapping step ("Sprnt 10 m" is the
 * 10 m sprint): every column of that name now reads as the test, at the trial its header gives
 * (trial 1 without one); undone (null), they are unread again. A long file's draft is unchanged.
 * @example withTestMatch(draft, ["athlete", "Sprnt 10 m 2"], "Sprnt 10 m", 7).columns // { "Sprnt 10 m 2": { testId: 7, trial: 2 } }
 */
export function withTestMatch(
  draft: MappingDraft,
  headers: string[],
  name: string,
  testId: number | null,
): MappingDraft {
  if (draft.format !== "wide") return draft;
  const key = aliasKey(name);
  const columns = { ...draft.columns };
  for (const header of headers) {
    if (header === draft.athleteColumn || header === "") continue;
    const split = parseTrialHeader(header);
    const trial = aliasKey(header) === key ? 1 : split && aliasKey(split.name) === key ? split.trial : null;
    if (trial !== null) columns[header] = testId === null ? "unread" : { testId, trial };
  }
  return { ...draft, columns };
}
