import type { Direction, ResultFlag, TrialRule } from "@/lib/domain";
import type { Suggestion } from "./suggest";

export type ImportFormat = "long" | "wide";
export const IMPORT_FORMATS = ["long", "wide"] as const;

export type Delimiter = "," | ";" | "\t" | "|";

/** A test of the session's battery, as the import needs it. */
export type ImportTest = {
  id: number;
  name: string;
  unit: string;
  /** How many decimals the test's scores are shown with, everywhere. */
  decimals: number;
  direction: Direction;
  trialRule: TrialRule;
  trialsPerSession: number;
  plausibleMin: number | null;
  plausibleMax: number | null;
  /** Other names files use for it (Test library), and names matched in this import. */
  aliases: string[];
};

/** An athlete on the session's squad roster, with other spellings remembered from earlier imports. */
export type ImportAthlete = {
  id: number;
  name: string;
  externalId: string | null;
  aliases: string[];
  /** Told apart by position and external id where two on the roster share a name. */
  position?: string | null;
};

/** What a file is checked against: the battery, the rest of the Test library, the roster. */
export type ImportContext = {
  squadName: string;
  tests: ImportTest[];
  /** Names of the organisation's tests that are not in this session's battery. */
  otherTestNames: string[];
  athletes: ImportAthlete[];
  /** Names (as normaliseName makes them) whose rows are left out, as asked in the mapping step. */
  leaveOut?: { athletes: Set<string>; tests: Set<string> };
};

export type LongColumns = { athlete: string | null; test: string | null; trial: string | null; value: string | null };

/** A wide column's target; null means the column is ignored. */
export type WideTarget = { testId: number; trial: number } | null;

export type ImportMapping =
  | { format: "long"; columns: LongColumns }
  | { format: "wide"; athleteColumn: string | null; columns: Record<string, WideTarget> };

/** How the suggestion read one wide column, for the mapping step. */
export type WideColumnStatus = "athlete" | "matched" | "ignored" | "unknown" | "not-in-battery";
export type WideColumnSuggestion = {
  header: string;
  status: WideColumnStatus;
  testId: number | null;
  trial: number | null;
};

/**
 * Everything the file holds for one athlete × test: `values[k]` is trial k + 1 (null where the
 * file has none) and `rows[k]` the spreadsheet row it came from (0 for none). Two flat arrays
 * per result rather than an object per cell: a 100 000-row file makes 100 000 fewer objects.
 */
export type ImportGroup = { athleteId: number; testId: number; values: (number | null)[]; rows: number[] };

/** The column header a trial value of a test was read from (for row/column messages). */
export type ColumnOf = (testId: number, trial: number) => string;

export type UnknownAthlete = {
  value: string;
  reason: "unknown" | "ambiguous";
  count: number;
  rows: number[];
  /** Roster athletes whose name is close to this one ("did you mean …?"), closest first. */
  suggestions?: Suggestion[];
};
export type UnknownTest = {
  name: string;
  reason: "unknown" | "not-in-battery";
  count: number;
  rows: number[];
  column?: string;
  /** Battery tests whose name is close to this one, closest first. */
  suggestions?: Suggestion[];
};

/**
 * Names in a file that the person importing has said are a roster athlete or a battery test
 * (the mapping step's "Use …"), keyed by the file's text.
 */
export type ImportMatches = {
  athletes: Record<string, number>;
  tests: Record<string, number>;
  /** Names whose rows this import leaves out, as asked (an athlete of another squad, a test not in the battery). */
  leaveOut?: { athletes: string[]; tests: string[] };
};

/** Rows left out of an import because their athlete or test name was asked to be, counted by name. */
export type LeftOut = { kind: "athlete" | "test"; name: string; rows: number };

export type ExistingResult = { trials: (number | null)[]; flag: ResultFlag | null; version: number };

export type ImportCounts = {
  /** Trial values in the file (empty cells not counted). */
  values: number;
  resultsCreated: number;
  resultsUpdated: number;
  /** Results the file leaves exactly as they are (same values already stored). */
  resultsUnchanged: number;
  /** Stored trial values (or flags) the import would overwrite. */
  trialsReplaced: number;
};
