/**
 * The one authorisation gate. Every route handler and server action starts with
 * `guard(...)`: signed in? role allowed? each named record inside the caller's reach?
 */
import "server-only";
import { type Actor, loadActor, sessionIsCurrent } from "@/lib/data/actors";
import { athleteInReach, sessionInReach, squadInReach, testInReach } from "@/lib/data/scope";
import type { Role } from "@/lib/domain";
import { forbidden, notFound, unauthenticated } from "@/lib/errors";
import { currentSession } from "./session";

// The role lists `roles` takes come with the guard; they are defined beside the rules they follow.
export { ATHLETES, MANAGERS, OWNERS, PUBLISHERS, STAFF } from "./permissions";
export type { Actor };

export type GuardOptions = {
  roles?: readonly Role[];
  squadId?: number;
  athleteId?: number;
  sessionId?: number;
  testId?: number;
};

export async function guard(options: GuardOptions = {}): Promise<Actor> {
  const session = await currentSession();
  // An ended session (sign-out, password change, removal) counts as signed out: 401 here,
  // the sign-in page through pageGuard.
  if (session === null || !(await sessionIsCurrent(session))) throw unauthenticated();
  const actor = await loadActor(session.userId);
  if (!actor) throw forbidden("Your account is not a member of any organisation.");
  await authorize(actor, options);
  return actor;
}

/** The checks of `guard` for an actor already resolved (also used directly by tests). */
export async function authorize(actor: Actor, options: GuardOptions): Promise<void> {
  if (options.roles && !options.roles.includes(actor.role)) throw forbidden();
  const checks: [number | undefined, (a: Actor, id: number) => Promise<boolean>, string][] = [
    [options.squadId, squadInReach, "Squad"],
    [options.athleteId, athleteInReach, "Athlete"],
    [options.sessionId, sessionInReach, "Session"],
    [options.testId, testInReach, "Test"],
  ];
  for (const [id, inReach, what] of checks) {
    if (id !== undefined && !(await inReach(actor, id))) throw notFound(what);
  }
}
