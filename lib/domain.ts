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

/** No test takes more than this many trials in one session: the Session sheet, the Test library and Import agree. */
export const MAX_TRIALS = 10;

/**
 * Every change the audit trail records. A new action is added here first, so that each place
 * that words or filters actions (the Recent changes list among them) fails to compile until it
 * knows the new one.
 */
export const AUDIT_ACTIONS = [
  "session.create",
  "session.update",
  "session.publish",
  "session.delete",
  "result.create",
  "result.update",
  "result.undo",
  "results.import",
  "squad.create",
  "squad.update",
  "roster.add",
  "athlete.update",
  "test.create",
  "test.update",
  "test.archive",
  "test.delete",
  "report.save",
  "member.invite",
  "member.update",
  "member.remove",
  "invitation.revoke",
  "invitation.accept",
  "password.reset",
  "athlete.deletion-request",
  "athlete.delete",
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const AUDIT_ENTITY_TYPES = [
  "session",
  "result",
  "upload",
  "squad",
  "athlete",
  "test",
  "report",
  "member",
  "invitation",
  "user",
] as const;

/** What the outbox sends; each kind has its own wording in lib/mail/templates. */
export const MAIL_KINDS = ["invitation", "password-reset", "results-published", "deletion-request"] as const;
export type MailKind = (typeof MAIL_KINDS)[number];
export type AuditEntityType = (typeof AUDIT_ENTITY_TYPES)[number];

/** The changes a Session sheet lists under Recent changes: its scores, typed or imported. */
export const SHEET_AUDIT_ACTIONS = [
  "result.create",
  "result.update",
  "result.undo",
  "results.import",
] as const satisfies readonly AuditAction[];
export type SheetAuditAction = (typeof SHEET_AUDIT_ACTIONS)[number];

/** The confidence levels a Change report offers; 90 % is the trade's usual choice for practical decisions. */
export const REPORT_CONFIDENCES = [0.8, 0.9, 0.95, 0.99] as const;
