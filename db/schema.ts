/**
 * The Changewise data model. Every row that belongs to a club carries its
 * organization id, so every query can be scoped to one tenant in its WHERE clause.
 */
import { sql } from "drizzle-orm";
import { blob, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";

import {
  AUDIT_ACTIONS,
  AUDIT_ENTITY_TYPES,
  DIRECTIONS,
  MAIL_KINDS,
  PHASES,
  RESULT_FLAGS,
  ROLES,
  SESSION_STATUSES,
  SEXES,
  SWC_METHODS,
  TRIAL_RULES,
} from "../lib/domain";

export type { Direction, Phase, ResultFlag, Role, SessionStatus, Sex, SwcMethod, TrialRule } from "../lib/domain";

const createdAt = () =>
  integer("created_at", { mode: "timestamp_ms" }).notNull().default(sql`(cast(unixepoch('subsec') * 1000 as integer))`);

export const organizations = sqliteTable("organizations", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  name: text("name").notNull(),
  createdAt: createdAt(),
});

export const users = sqliteTable("users", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  passwordHash: text("password_hash"),
  /**
   * Carried in every session token; raising it ends every session issued before (sign-out,
   * password change or reset, removal), since a JWT cannot be recalled from the browser.
   */
  sessionVersion: integer("session_version").notNull().default(0),
  createdAt: createdAt(),
});

export const memberships = sqliteTable(
  "memberships",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    role: text("role", { enum: ROLES }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("memberships_user_org_unique").on(t.userId, t.organizationId),
    index("memberships_org_idx").on(t.organizationId),
  ],
);

export const squads = sqliteTable(
  "squads",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    sport: text("sport"),
    archived: integer("archived", { mode: "boolean" }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("squads_org_name_unique").on(t.organizationId, t.name)],
);

export const squadCoaches = sqliteTable(
  "squad_coaches",
  {
    squadId: integer("squad_id")
      .notNull()
      .references(() => squads.id, { onDelete: "cascade" }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.squadId, t.userId] }), index("squad_coaches_user_idx").on(t.userId)],
);

export const athletes = sqliteTable(
  "athletes",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    userId: integer("user_id").references(() => users.id, { onDelete: "set null" }),
    name: text("name").notNull(),
    dateOfBirth: text("date_of_birth"),
    sex: text("sex", { enum: SEXES }),
    position: text("position"),
    externalId: text("external_id"),
    /** Other spellings of the name the Import has been told are this athlete (remembered matches). */
    aliases: text("aliases", { mode: "json" }).$type<string[]>().notNull().default([]),
    notes: text("notes"),
    /** Day the athlete's consent to have results processed and shown to them was recorded (YYYY-MM-DD). */
    consentRecordedOn: text("consent_recorded_on"),
    /** For a minor: day a parent's or guardian's consent was recorded (YYYY-MM-DD). */
    guardianConsentOn: text("guardian_consent_on"),
    archived: integer("archived", { mode: "boolean" }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [
    index("athletes_org_idx").on(t.organizationId),
    uniqueIndex("athletes_user_unique").on(t.userId),
    uniqueIndex("athletes_org_external_unique").on(t.organizationId, t.externalId),
  ],
);

export const squadAthletes = sqliteTable(
  "squad_athletes",
  {
    squadId: integer("squad_id")
      .notNull()
      .references(() => squads.id, { onDelete: "cascade" }),
    athleteId: integer("athlete_id")
      .notNull()
      .references(() => athletes.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.squadId, t.athleteId] }), index("squad_athletes_athlete_idx").on(t.athleteId)],
);

export const tests = sqliteTable(
  "tests",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    unit: text("unit").notNull(),
    decimals: integer("decimals").notNull().default(2),
    direction: text("direction", { enum: DIRECTIONS }).notNull(),
    trialRule: text("trial_rule", { enum: TRIAL_RULES }).notNull().default("best"),
    trialsPerSession: integer("trials_per_session").notNull().default(3),
    swcMethod: text("swc_method", { enum: SWC_METHODS }).notNull().default("sd-factor"),
    /** The factor (sd-factor, cv-factor) or the value in the test's unit (fixed). */
    swcValue: real("swc_value").notNull().default(0.2),
    /** Within-athlete CV% used by the cv-factor SWC method. */
    cvPercent: real("cv_percent"),
    typicalError: real("typical_error"),
    typicalErrorDf: integer("typical_error_df"),
    typicalErrorSource: text("typical_error_source"),
    plausibleMin: real("plausible_min"),
    plausibleMax: real("plausible_max"),
    /** Other names files use for this test ("CMJ"); the Import reads them as this test. */
    aliases: text("aliases", { mode: "json" }).$type<string[]>().notNull().default([]),
    archived: integer("archived", { mode: "boolean" }).notNull().default(false),
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("tests_org_name_unique").on(t.organizationId, t.name)],
);

export const testingSessions = sqliteTable(
  "testing_sessions",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    squadId: integer("squad_id")
      .notNull()
      .references(() => squads.id, { onDelete: "cascade" }),
    /** ISO date (YYYY-MM-DD) of the testing day. */
    date: text("date").notNull(),
    phase: text("phase", { enum: PHASES }).notNull(),
    status: text("status", { enum: SESSION_STATUSES }).notNull().default("draft"),
    notes: text("notes"),
    version: integer("version").notNull().default(1),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    publishedAt: integer("published_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [
    index("sessions_org_date_idx").on(t.organizationId, t.date),
    index("sessions_squad_date_idx").on(t.squadId, t.date),
  ],
);

/** The battery: which tests a session measures, in display order. */
export const sessionTests = sqliteTable(
  "session_tests",
  {
    sessionId: integer("session_id")
      .notNull()
      .references(() => testingSessions.id, { onDelete: "cascade" }),
    testId: integer("test_id")
      .notNull()
      .references(() => tests.id, { onDelete: "restrict" }),
    position: integer("position").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.sessionId, t.testId] }), index("session_tests_test_idx").on(t.testId)],
);

export const results = sqliteTable(
  "results",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    sessionId: integer("session_id")
      .notNull()
      .references(() => testingSessions.id, { onDelete: "cascade" }),
    athleteId: integer("athlete_id")
      .notNull()
      .references(() => athletes.id, { onDelete: "cascade" }),
    testId: integer("test_id")
      .notNull()
      .references(() => tests.id, { onDelete: "restrict" }),
    /** JSON array of trial scores in entry order; null marks an empty trial slot. */
    trials: text("trials", { mode: "json" }).$type<(number | null)[]>().notNull().default(sql`'[]'`),
    /** The trials reduced by the test's rule (best or mean); null when no valid trial. */
    value: real("value"),
    flag: text("flag", { enum: RESULT_FLAGS }),
    note: text("note"),
    updatedBy: integer("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" })
      .notNull()
      .default(sql`(cast(unixepoch('subsec') * 1000 as integer))`),
    version: integer("version").notNull().default(1),
  },
  (t) => [
    uniqueIndex("results_session_athlete_test_unique").on(t.sessionId, t.athleteId, t.testId),
    // Change reports read one test across two sessions; progress pages read one athlete over time.
    index("results_test_session_idx").on(t.testId, t.sessionId),
    index("results_athlete_test_idx").on(t.athleteId, t.testId),
  ],
);

export const reliabilityStudies = sqliteTable(
  "reliability_studies",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    testId: integer("test_id")
      .notNull()
      .references(() => tests.id, { onDelete: "cascade" }),
    firstSessionId: integer("first_session_id").references(() => testingSessions.id, { onDelete: "set null" }),
    secondSessionId: integer("second_session_id").references(() => testingSessions.id, { onDelete: "set null" }),
    label: text("label"),
    n: integer("n").notNull(),
    typicalError: real("typical_error").notNull(),
    typicalErrorDf: integer("typical_error_df").notNull(),
    cvPercent: real("cv_percent"),
    icc31: real("icc31"),
    icc21: real("icc21"),
    /** Full result of the computation, kept so a report can be reproduced later. */
    summary: text("summary", { mode: "json" }).$type<Record<string, unknown>>(),
    adoptedAt: integer("adopted_at", { mode: "timestamp_ms" }),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("reliability_org_test_idx").on(t.organizationId, t.testId)],
);

/**
 * A Change report saved with the scientist's interpretation note: the settings that reproduce
 * it and a snapshot of every number as it stood, so it reopens exactly as written even after
 * scores change (and can say that they did).
 */
export const savedReports = sqliteTable(
  "saved_reports",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    squadId: integer("squad_id")
      .notNull()
      .references(() => squads.id, { onDelete: "cascade" }),
    testId: integer("test_id")
      .notNull()
      .references(() => tests.id, { onDelete: "cascade" }),
    // A saved report holds athletes' scores: it goes when either of its sessions goes.
    fromSessionId: integer("from_session_id")
      .notNull()
      .references(() => testingSessions.id, { onDelete: "cascade" }),
    toSessionId: integer("to_session_id")
      .notNull()
      .references(() => testingSessions.id, { onDelete: "cascade" }),
    settings: text("settings", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
    snapshot: text("snapshot", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
    note: text("note").notNull(),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("saved_reports_org_squad_idx").on(t.organizationId, t.squadId, t.createdAt)],
);

export const uploads = sqliteTable(
  "uploads",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    // Raw files hold personal data: they go when their session goes.
    sessionId: integer("session_id").references(() => testingSessions.id, { onDelete: "cascade" }),
    filename: text("filename").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    contentType: text("content_type"),
    content: blob("content", { mode: "buffer" }).notNull(),
    format: text("format"),
    rowsImported: integer("rows_imported").notNull().default(0),
    createdBy: integer("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("uploads_org_idx").on(t.organizationId)],
);

export const auditEvents = sqliteTable(
  "audit_events",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    actorUserId: integer("actor_user_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action", { enum: AUDIT_ACTIONS }).notNull(),
    entityType: text("entity_type", { enum: AUDIT_ENTITY_TYPES }).notNull(),
    entityId: integer("entity_id"),
    /** Session the change belongs to, so a sheet can list and undo its own changes. */
    sessionId: integer("session_id"),
    before: text("before", { mode: "json" }).$type<unknown>(),
    after: text("after", { mode: "json" }).$type<unknown>(),
    undoneAt: integer("undone_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [
    index("audit_org_entity_idx").on(t.organizationId, t.entityType, t.entityId),
    index("audit_session_idx").on(t.sessionId, t.id),
  ],
);

export const invitations = sqliteTable(
  "invitations",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    athleteId: integer("athlete_id").references(() => athletes.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: integer("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    acceptedAt: integer("accepted_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_org_idx").on(t.organizationId)],
);

export const passwordResetTokens = sqliteTable("password_reset_tokens", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  userId: integer("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  tokenHash: text("token_hash").notNull().unique(),
  expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
  usedAt: integer("used_at", { mode: "timestamp_ms" }),
  createdAt: createdAt(),
});

/** Failed sign-ins, kept in the database so throttling holds across server processes. */
export const signInAttempts = sqliteTable(
  "sign_in_attempts",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    email: text("email").notNull(),
    address: text("address").notNull(),
    attemptedAt: integer("attempted_at").notNull(),
  },
  (t) => [
    index("sign_in_attempts_email_idx").on(t.email, t.attemptedAt),
    index("sign_in_attempts_address_idx").on(t.address, t.attemptedAt),
  ],
);

/**
 * Mail waiting to go, written in the same transaction as the change that causes it and sent after
 * the commit, with retries: a mail server that is down delays mail but never loses it, and never
 * fails the request. Once sent, the body is cleared (it may hold a one-time link).
 */
export const mailOutbox = sqliteTable(
  "mail_outbox",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id").references(() => organizations.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: MAIL_KINDS }).notNull(),
    to: text("to_address").notNull(),
    subject: text("subject").notNull(),
    text: text("body_text"),
    html: text("body_html"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: integer("next_attempt_at", { mode: "timestamp_ms" }).notNull(),
    sentAt: integer("sent_at", { mode: "timestamp_ms" }),
    lastError: text("last_error"),
    createdAt: createdAt(),
  },
  (t) => [index("mail_outbox_due_idx").on(t.sentAt, t.nextAttemptAt)],
);

/** An athlete's request that the club delete them and their results; the owner acts on it. */
export const deletionRequests = sqliteTable(
  "deletion_requests",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    organizationId: integer("organization_id")
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    athleteId: integer("athlete_id")
      .notNull()
      .references(() => athletes.id, { onDelete: "cascade" }),
    message: text("message"),
    requestedAt: integer("requested_at", { mode: "timestamp_ms" }).notNull(),
  },
  (t) => [uniqueIndex("deletion_requests_athlete_unique").on(t.athleteId)],
);
