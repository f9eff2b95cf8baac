/**
 * The words of the domain: roles, test directions, trial rules, phases, states. A plain module
 * so that the browser can use them without loading the database schema, which builds its
 * column types from these same lists.
 */
export const ROLES = ["owner", "scientist", "coach", "athlete"] as const;
export type Role = (typeof ROLES)[number];

export const DIRECTIONS = ["higher", "lower"] as const;
export type Direction = (typeof DIRECTIONS)[number];

export const TRIAL_RULES = ["best", "mean"] as const;
export type TrialRule = (typeof TRIAL_RULES)[number];

/** sd-factor: factor × baseline between-athlete SD; fixed: a value in the test's unit; cv-factor: factor × CV% of the mean. */
export const SWC_METHODS = ["sd-factor", "fixed", "cv-factor"] as const;
export type SwcMethod = (typeof SWC_METHODS)[number];

export const PHASES = ["baseline", "pre-block", "post-block", "retest", "in-season"] as const;
export type Phase = (typeof PHASES)[number];

export const SESSION_STATUSES = ["draft", "published"] as const;
export type SessionStatus = (typeof SESSION_STATUSES)[number];

export const RESULT_FLAGS = ["absent", "injured", "invalid"] as const;
export type ResultFlag = (typeof RESULT_FLAGS)[number];

export const SEXES = ["female", "male", "other"] as const;
export type Sex = (typeof SEXES)[number];
