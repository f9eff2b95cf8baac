/**
 * Who may do what: the one place the product's role rules (PRODUCT.md §2) are written down.
 * Pure functions of the caller's role and, where it matters, the record's state, so the server
 * decides with them and the screens can show or hide a control by the very same rule.
 * Reach (which squads, athletes and sessions a caller sees at all) is the WHERE-clause work of
 * lib/data/scope.ts, which asks these functions which rule applies.
 */
import { ROLES, type Role, type SessionStatus } from "@/lib/domain";

/** Anything that has a role: the server's Actor, or the role the screens read from /api/me. */
export type RoleHolder = { readonly role: Role };

export const isOwner = (who: RoleHolder) => who.role === "owner";
/** Owner and scientist: the whole organisation is in their reach. */
export const isManager = (who: RoleHolder) => who.role === "owner" || who.role === "scientist";
/** Coaches reach only the squads they are assigned to. */
export const isCoach = (who: RoleHolder) => who.role === "coach";
export const isAthlete = (who: RoleHolder) => who.role === "athlete";
export const isStaff = (who: RoleHolder) => !isAthlete(who);

/** Coaches write into draft sessions only; a published session is corrected by a scientist or the owner. */
export const canEditSession = (who: RoleHolder, status: SessionStatus) =>
  isManager(who) || (isCoach(who) && status === "draft");

/**
 * Deleting a session made by mistake: drafts only (a published session goes back to draft
 * first). Owner and scientist any draft; a coach the drafts they created.
 */
export const canDeleteSession = (
  who: RoleHolder & { readonly userId: number },
  session: { status: SessionStatus; createdBy: number | null },
) => session.status === "draft" && (isManager(who) || (isCoach(who) && session.createdBy === who.userId));

/** Publishing (or withdrawing) a session's results to its athletes. */
export const canPublish = isManager;

/** Creating, renaming and archiving squads, and assigning their coaches. */
export const canManageSquad = isOwner;

/** Adding athletes to a squad in reach, editing them, moving them between squads. */
export const canEditRoster = isStaff;

/** How many results use each test (all athletes of the organisation together): staff only. */
export const canSeeResultCounts = isStaff;

/** Interpretation notes are the sport scientist's (PRODUCT.md §2); coaches read them for their squads. */
export const canWriteInterpretation = isManager;

/** Every member reads the Test library; only these change it. */
export const canEditTestLibrary = isManager;

/** The Reliability check measures a test's noise and may change the Test library's typical error. */
export const canRunReliability = isManager;

/** Members, roles, invitations and the mail outbox: the organisation's owner (PRODUCT.md §2). */
export const canManagePeople = isOwner;

/** Deleting an athlete and every trace of them, e.g. on their request: the owner. */
export const canDeleteAthlete = isOwner;

/** Asking the organisation to delete one's own record: athletes, about themselves. */
export const canRequestDeletion = isAthlete;
/** My progress and the data-rights export: an athlete's own results, read by the athlete alone. */
export const hasOwnProgress = isAthlete;

/** Who is told, before publishing, which athletes will see their results and who will get mail. */
export const canSeePublishAudience = canPublish;

const rolesWhere = (rule: (who: RoleHolder) => boolean): readonly Role[] => ROLES.filter((role) => rule({ role }));

// The role lists `guard({ roles })` takes, derived from the rules above so the two cannot drift.
export const STAFF = rolesWhere(isStaff);
export const MANAGERS = rolesWhere(isManager);
export const OWNERS = rolesWhere(isOwner);
export const RELIABILITY_ROLES = rolesWhere(canRunReliability);
export const PEOPLE_ROLES = rolesWhere(canManagePeople);
export const DELETION_ROLES = rolesWhere(canDeleteAthlete);
export const DELETION_REQUEST_ROLES = rolesWhere(canRequestDeletion);
export const ATHLETES = rolesWhere(hasOwnProgress);
export const PUBLISHERS = rolesWhere(canSeePublishAudience);
