/**
 * The JSON shapes the staff screens read from the API (see the route handlers under app/api).
 * Kept client-side so components never import server modules.
 */
import type { Direction, Phase, ResultFlag, SessionStatus, SwcMethod, TrialRule } from "@/db/schema";

export type TestItem = {
  id: number;
  name: string;
  unit: string;
  decimals: number;
  direction: Direction;
  trialRule: TrialRule;
  trialsPerSession: number;
  swcMethod: SwcMethod;
  swcValue: number;
  cvPercent: number | null;
  typicalError: number | null;
  typicalErrorDf: number | null;
  typicalErrorSource: string | null;
  plausibleMin: number | null;
  plausibleMax: number | null;
  archived: boolean;
  version: number;
  resultCount: number;
};

export type SquadListItem = {
  id: number;
  name: string;
  sport: string | null;
  archived: boolean;
  athleteCount: number;
  latestSession: { id: number; date: string; phase: string; status: string } | null;
};

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

export type SessionListItem = {
  id: number;
  squadId: number;
  squadName: string;
  date: string;
  phase: Phase;
  status: SessionStatus;
  notes: string | null;
  testIds: number[];
  resultCount: number;
};

export type SheetTest = {
  id: number;
  name: string;
  unit: string;
  decimals: number;
  direction: Direction;
  trialRule: TrialRule;
  trialsPerSession: number;
  plausibleMin: number | null;
  plausibleMax: number | null;
};

export type ResultRow = {
  id: number;
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  value: number | null;
  flag: ResultFlag | null;
  note: string | null;
  version: number;
  updatedAt: number;
  updatedByName: string | null;
};

export type SheetData = {
  session: {
    id: number;
    squadId: number;
    squadName: string;
    date: string;
    phase: Phase;
    status: SessionStatus;
    notes: string | null;
    version: number;
  };
  tests: SheetTest[];
  athletes: { id: number; name: string; position: string | null }[];
  results: ResultRow[];
  canEdit: boolean;
  canPublish: boolean;
};

export type ResultConflict = { athleteId: number; testId: number; current: ResultRow | null };

export type AuditSnapshot = { trials: (number | null)[]; flag: ResultFlag | null; note: string | null };

export type AuditEvent = {
  id: number;
  at: number;
  actorName: string | null;
  athleteName: string | null;
  testName: string | null;
  action: string;
  before: AuditSnapshot | null;
  after: AuditSnapshot | null;
  /** For a file import: what was imported. */
  details?: { filename?: string; rows?: number } | null;
  undone: boolean;
};
