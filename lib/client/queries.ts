/**
 * Every read the screens make, defined once: a structured key and a typed fetch. The data type
 * of each query is the return type of the lib/data function its route answers with, so a page
 * that prefetches on the server (`lib/query/prefetch.ts`) and a client that fetches over HTTP
 * hold the same shape. Keys nest (`["sessions", 7, "audit"]` under `["sessions"]`), so a write
 * invalidates a whole family with one prefix.
 */
import { queryOptions } from "@tanstack/react-query";
import type { previewAthleteDeletion } from "@/lib/data/athlete-deletion";
import type { getAthleteHistory } from "@/lib/data/athlete-history";
import type { listAthleteResults } from "@/lib/data/athlete-results";
import type { getAthlete, listAthletes, listSquadAthletes } from "@/lib/data/athletes";
import type { listSessionAudit } from "@/lib/data/audit";
import type { listDeletionRequests } from "@/lib/data/deletion-requests";
import type { listClaimableAthletes, listInvitations } from "@/lib/data/invitations";
import type { listMembers } from "@/lib/data/members";
import type { getMyProgress } from "@/lib/data/my-progress";
import type { getCapturedMessage, getOutbox } from "@/lib/data/outbox";
import type { getPublishCheck } from "@/lib/data/publish-mail";
import type { getReliabilityFromFile, getReliabilityReport } from "@/lib/data/reliability";
import type { getChangeReport, getSavedReport, listSavedReports } from "@/lib/data/reports";
import type { getSessionSheet, listSessions } from "@/lib/data/sessions";
import type { getSquad, listCoaches, listSquads } from "@/lib/data/squads";
import type { listTests } from "@/lib/data/tests";
import type { getWorkToDo } from "@/lib/data/work-to-do";
import type { ChangeReportQuery, ReliabilityQuery } from "@/lib/validation/reports";
import { fetchJson } from "./fetch-json";

/** What a lib/data function resolves to: the payload of the query that reads it. */
export type Loaded<F extends (...args: never[]) => Promise<unknown>> = Awaited<ReturnType<F>>;

const archivedParam = (archived: boolean) => (archived ? "?archived=include" : "");

export const queryKeys = {
  squads: ["squads"] as const,
  athletes: ["athletes"] as const,
  tests: ["tests"] as const,
  sessions: ["sessions"] as const,
  coaches: ["coaches"] as const,
  reports: ["reports"] as const,
  people: ["people"] as const,
  outbox: ["outbox"] as const,
};

export const squadQueries = {
  list: ({ archived = false } = {}) =>
    queryOptions({
      queryKey: [...queryKeys.squads, "list", { archived }] as const,
      queryFn: () =>
        fetchJson<{ squads: Loaded<typeof listSquads> }>(`/api/squads${archivedParam(archived)}`).then((r) => r.squads),
    }),
  /** The staff home's "What needs doing" in the caller's squads. */
  workToDo: () =>
    queryOptions({
      // Under sessions: any change to a session or its scores can change what is left to do.
      queryKey: [...queryKeys.sessions, "work-to-do"] as const,
      queryFn: () => fetchJson<Loaded<typeof getWorkToDo>>("/api/work-to-do"),
    }),
  detail: (squadId: number) =>
    queryOptions({
      queryKey: [...queryKeys.squads, squadId] as const,
      queryFn: () => fetchJson<Loaded<typeof getSquad>>(`/api/squads/${squadId}`),
    }),
  roster: (squadId: number, { archived = false } = {}) =>
    queryOptions({
      // Under the squad, so any change to the squad refreshes its roster too.
      queryKey: [...queryKeys.squads, squadId, "athletes", { archived }] as const,
      queryFn: () =>
        fetchJson<{ athletes: Loaded<typeof listSquadAthletes> }>(
          `/api/squads/${squadId}/athletes${archivedParam(archived)}`,
        ).then((r) => r.athletes),
    }),
};

export const coachQueries = {
  list: () =>
    queryOptions({
      queryKey: [...queryKeys.coaches] as const,
      queryFn: () => fetchJson<{ coaches: Loaded<typeof listCoaches> }>("/api/coaches").then((r) => r.coaches),
    }),
};

export const athleteQueries = {
  list: () =>
    queryOptions({
      queryKey: [...queryKeys.athletes, "list"] as const,
      queryFn: () => fetchJson<{ athletes: Loaded<typeof listAthletes> }>("/api/athletes").then((r) => r.athletes),
    }),
  detail: (athleteId: number) =>
    queryOptions({
      queryKey: [...queryKeys.athletes, athleteId] as const,
      queryFn: () =>
        fetchJson<{ athlete: Loaded<typeof getAthlete> }>(`/api/athletes/${athleteId}`).then((r) => r.athlete),
    }),
  results: (athleteId: number) =>
    queryOptions({
      queryKey: [...queryKeys.athletes, athleteId, "results"] as const,
      queryFn: () =>
        fetchJson<{ results: Loaded<typeof listAthleteResults> }>(`/api/athletes/${athleteId}/results`).then(
          (r) => r.results,
        ),
    }),
  history: (athleteId: number) =>
    queryOptions({
      queryKey: [...queryKeys.athletes, athleteId, "history"] as const,
      queryFn: () => fetchJson<Loaded<typeof getAthleteHistory>>(`/api/athletes/${athleteId}/history`),
    }),
  /** My progress: the signed-in athlete's own tests over their published sessions. */
  myProgress: () =>
    queryOptions({
      queryKey: [...queryKeys.athletes, "me", "progress"] as const,
      queryFn: () => fetchJson<Loaded<typeof getMyProgress>>("/api/me/progress"),
    }),
};

export const testQueries = {
  list: ({ archived = false } = {}) =>
    queryOptions({
      queryKey: [...queryKeys.tests, "list", { archived }] as const,
      queryFn: () =>
        fetchJson<{ tests: Loaded<typeof listTests> }>(`/api/tests${archivedParam(archived)}`).then((r) => r.tests),
    }),
};

export const sessionQueries = {
  list: ({ squadId = null }: { squadId?: number | null } = {}) =>
    queryOptions({
      queryKey: [...queryKeys.sessions, "list", { squadId }] as const,
      queryFn: () =>
        fetchJson<{ sessions: Loaded<typeof listSessions> }>(
          squadId ? `/api/sessions?squadId=${squadId}` : "/api/sessions",
        ).then((r) => r.sessions),
    }),
  sheet: (sessionId: number) =>
    queryOptions({
      queryKey: [...queryKeys.sessions, sessionId] as const,
      queryFn: () => fetchJson<Loaded<typeof getSessionSheet>>(`/api/sessions/${sessionId}`),
    }),
  /** Read by the publish dialog when it opens: who will see the results and get mail, and why not. */
  publishCheck: (sessionId: number) =>
    queryOptions({
      queryKey: [...queryKeys.sessions, sessionId, "publish-check"] as const,
      queryFn: () => fetchJson<Loaded<typeof getPublishCheck>>(`/api/sessions/${sessionId}/publish-check`),
    }),
  audit: (sessionId: number) =>
    queryOptions({
      queryKey: [...queryKeys.sessions, sessionId, "audit"] as const,
      queryFn: () =>
        fetchJson<{ events: Loaded<typeof listSessionAudit> }>(`/api/sessions/${sessionId}/audit`).then(
          (r) => r.events,
        ),
    }),
};

/** The query string of a Change report: the same names and values its page URL carries. */
export function changeReportSearch(q: Omit<ChangeReportQuery, "swcValue"> & { swcValue?: number }): string {
  const params = new URLSearchParams({
    testId: String(q.testId),
    fromSessionId: String(q.fromSessionId),
    toSessionId: String(q.toSessionId),
    confidence: String(q.confidence),
  });
  if (q.swcMethod && q.swcValue !== undefined) {
    params.set("swcMethod", q.swcMethod);
    params.set("swcValue", String(q.swcValue));
  }
  return params.toString();
}

export const reportQueries = {
  saved: (squadId: number) =>
    queryOptions({
      queryKey: [...queryKeys.reports, "saved", { squadId }] as const,
      queryFn: () =>
        fetchJson<{ reports: Loaded<typeof listSavedReports> }>(`/api/reports/notes?squadId=${squadId}`).then(
          (r) => r.reports,
        ),
    }),
  savedOne: (reportId: number) =>
    queryOptions({
      queryKey: [...queryKeys.reports, "saved", reportId] as const,
      queryFn: () =>
        fetchJson<{ report: Loaded<typeof getSavedReport> }>(`/api/reports/notes/${reportId}`).then((r) => r.report),
    }),
  change: (q: ChangeReportQuery) =>
    queryOptions({
      // Keyed by the URL's query, so a shared link and the screen's own reads meet in one entry.
      queryKey: [...queryKeys.reports, "change", changeReportSearch(q)] as const,
      queryFn: () => fetchJson<Loaded<typeof getChangeReport>>(`/api/reports/change?${changeReportSearch(q)}`),
    }),
};

/** The Reliability check's settings as URL search params (its page link and its API query). */
export function reliabilitySearch(q: ReliabilityQuery): string {
  return new URLSearchParams({
    testId: String(q.testId),
    firstSessionId: String(q.firstSessionId),
    secondSessionId: String(q.secondSessionId),
    confidence: String(q.confidence),
  }).toString();
}

export const reliabilityQueries = {
  report: (q: ReliabilityQuery) =>
    queryOptions({
      // Under "reports", so adopting a typical error refreshes it with the Change report.
      queryKey: [...queryKeys.reports, "reliability", reliabilitySearch(q)] as const,
      queryFn: () => fetchJson<Loaded<typeof getReliabilityReport>>(`/api/reports/reliability?${reliabilitySearch(q)}`),
    }),
};

export type SquadSummary = Loaded<typeof listSquads>[number];
export type SquadDetail = Loaded<typeof getSquad>;
export type RosterAthlete = Loaded<typeof listSquadAthletes>[number];
export type AthleteListItem = Loaded<typeof listAthletes>[number];
export type TestItem = Loaded<typeof listTests>[number];
export type SheetData = Loaded<typeof getSessionSheet>;
export type SheetTest = SheetData["tests"][number];
export type ResultRow = SheetData["results"][number];
export type AuditEvent = Loaded<typeof listSessionAudit>[number];
export type AthleteHistoryData = Loaded<typeof getAthleteHistory>;
export type MyProgressData = Loaded<typeof getMyProgress>;
export type PublishCheckData = Loaded<typeof getPublishCheck>;
export type WorkToDo = Loaded<typeof getWorkToDo>;
export type ChangeReportData = Loaded<typeof getChangeReport>;
export type ReliabilityData = Loaded<typeof getReliabilityReport>;
export type ReliabilityFileData = Loaded<typeof getReliabilityFromFile>;
/** A test–retest study as the screens show it, from two sessions or from a two-trial file. */
export type ReliabilityStudy = ReliabilityData | ReliabilityFileData;
export type SavedReportItem = Loaded<typeof listSavedReports>[number];

export const peopleQueries = {
  members: () =>
    queryOptions({
      queryKey: [...queryKeys.people, "members"] as const,
      queryFn: () => fetchJson<{ members: Loaded<typeof listMembers> }>("/api/members").then((r) => r.members),
    }),
  /** Waiting invitations, and the athletes an athlete invitation may still claim. */
  invitations: () =>
    queryOptions({
      queryKey: [...queryKeys.people, "invitations"] as const,
      queryFn: () =>
        fetchJson<{
          invitations: Loaded<typeof listInvitations>;
          claimableAthletes: Loaded<typeof listClaimableAthletes>;
        }>("/api/invitations"),
    }),
  deletionRequests: () =>
    queryOptions({
      queryKey: [...queryKeys.people, "deletion-requests"] as const,
      queryFn: () =>
        fetchJson<{ requests: Loaded<typeof listDeletionRequests> }>("/api/deletion-requests").then((r) => r.requests),
    }),
  /** What deleting an athlete would remove (read when the confirmation opens). */
  deletionPreview: (athleteId: number) =>
    queryOptions({
      queryKey: [...queryKeys.athletes, athleteId, "deletion"] as const,
      queryFn: () => fetchJson<Loaded<typeof previewAthleteDeletion>>(`/api/athletes/${athleteId}/deletion`),
    }),
};

export const outboxQueries = {
  list: () =>
    queryOptions({
      queryKey: [...queryKeys.outbox] as const,
      queryFn: () => fetchJson<Loaded<typeof getOutbox>>("/api/outbox"),
    }),
  message: (messageId: string) =>
    queryOptions({
      queryKey: [...queryKeys.outbox, messageId] as const,
      queryFn: () =>
        fetchJson<{ message: Loaded<typeof getCapturedMessage> }>(`/api/outbox/${encodeURIComponent(messageId)}`).then(
          (r) => r.message,
        ),
    }),
};

export type MemberItem = Loaded<typeof listMembers>[number];
export type InvitationItem = Loaded<typeof listInvitations>[number];
export type ClaimableAthlete = Loaded<typeof listClaimableAthletes>[number];
export type DeletionRequestItem = Loaded<typeof listDeletionRequests>[number];
export type OutboxData = Loaded<typeof getOutbox>;
