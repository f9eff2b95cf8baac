/**
 * The JSON shapes the screens read from the API (see the route handlers under app/api).
 * Where a query in lib/data already names a shape, it is re-exported from there: type-only
 * imports are erased, so no server module reaches the client bundle.
 */
import type { Phase, SessionStatus } from "@/lib/domain";
import type { ResultRow } from "@/lib/data/results";
import type { TestRow } from "@/lib/data/tests";

export type { AthleteListItem } from "@/lib/data/athletes";
export type { AuditEvent } from "@/lib/data/audit";
export type { AthleteResult } from "@/lib/data/athlete-results";
export type { ResultRow } from "@/lib/data/results";
export type { SquadSummary } from "@/lib/data/squads";
/** A test as one test's GET, POST and PATCH return it. */
export type { TestRow } from "@/lib/data/tests";

/** A test of the Test library as `GET /api/tests` lists it. */
export type TestItem = TestRow & { resultCount: number };

export type Person = { id: number; name: string; email: string };

export type SquadDetail = {
  squad: { id: number; name: string; sport: string | null; archived: boolean; coaches: Person[] };
  canManage: boolean;
};

export type Sex = "female" | "male" | "other";

export type RosterAthlete = {
  id: number;
  name: string;
  position: string | null;
  sex: Sex | null;
  dateOfBirth: string | null;
  externalId: string | null;
  notes: string | null;
  archived: boolean;
};

/** A testing session as both the Sessions list and the Session sheet read it. */
export type SessionHeader = {
  id: number;
  squadId: number;
  squadName: string;
  date: string;
  phase: Phase;
  status: SessionStatus;
  notes: string | null;
  version: number;
};

export type SessionListItem = SessionHeader & { testIds: number[]; resultCount: number };

/** The battery columns of the Session sheet. */
export type SheetTest = Pick<
  TestRow,
  "id" | "name" | "unit" | "decimals" | "direction" | "trialRule" | "trialsPerSession" | "plausibleMin" | "plausibleMax"
>;

export type SheetData = {
  session: SessionHeader;
  tests: SheetTest[];
  athletes: { id: number; name: string; position: string | null }[];
  results: ResultRow[];
  canEdit: boolean;
  canPublish: boolean;
};

export type ResultConflict = { athleteId: number; testId: number; current: ResultRow | null };
