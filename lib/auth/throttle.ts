import "server-only";
import { type AttemptCounts, releaseAttempt, reserveAttempt } from "@/lib/data/sign-in";
import { UNKNOWN_ADDRESS } from "./client-address";

/** Failures a minute on one account before it is held (for addresses already failing on it). */
export const MAX_FAILURES_PER_EMAIL = 5;
/**
 * Failures a minute before one address is held: higher, because a whole club often signs in
 * from one address (one NAT), and a few typos by different staff must not lock everyone out.
 */
export const MAX_FAILURES_PER_ADDRESS = 20;
const WINDOW_MS = 60_000;

export const THROTTLED_MESSAGE = "Too many failed sign-ins. Wait a minute, then try again.";

/**
 * Whether one more attempt may be checked, given the attempts in the window (failures and
 * attempts still being checked).
 *
 * An account under attack is held only for the addresses that have failed on it. A hard lock for
 * everyone would let anyone lock any member out with five wrong passwords a minute; a growing
 * delay would too, as long as the attacker keeps taking every slot. So an address that has not
 * failed on the account may still try — once, since that try counts against it. The price: an
 * attacker with many addresses gets one guess per address per minute, still bounded by the
 * per-address limit. Without a declared proxy the address is unknown and all callers share one
 * bucket: the account lock then holds everyone (no address can prove it is not the attacker), and
 * the per-address limit is skipped, because that shared bucket would let one person hold back the
 * whole club.
 */
export function mayTry(counts: AttemptCounts, address: string): boolean {
  const known = address !== UNKNOWN_ADDRESS;
  if (known && counts.byAddress >= MAX_FAILURES_PER_ADDRESS) return false;
  if (counts.byEmail < MAX_FAILURES_PER_EMAIL) return true;
  return known && counts.byEmailFromAddress === 0;
}

export type Reservation = { email: string; address: string; id: number };

/** Counts this attempt before the password is checked; null when it is held. */
export async function reserveSignIn(email: string, address: string, now = Date.now()): Promise<Reservation | null> {
  const id = await reserveAttempt(email, address, { since: now - WINDOW_MS, at: now }, (counts) =>
    mayTry(counts, address),
  );
  return id === null ? null : { email, address, id };
}

/** The password was right: the attempt is not a failure. */
export function releaseSignIn({ email, address, id }: Reservation) {
  return releaseAttempt(email, address, id);
}

/**
 * Password-reset requests, per 15 minutes: a few per account (each one sends a mail, so more would
 * let anyone flood a member's inbox) and a bounded number per address. Without a declared proxy all
 * callers share one bucket, so that bucket gets a larger allowance.
 */
export const MAX_RESETS_PER_EMAIL = 3;
export const MAX_RESETS_PER_ADDRESS = 10;
const SHARED_BUCKET_RESETS = 100;
const RESET_WINDOW_MS = 15 * 60_000;

/**
 * "send": record and mail; "quiet": this account had its share, answer as always but mail nothing
 * (the answer must not differ, or it would tell who has an account); "held": the address asked too
 * often, a 429 that says nothing about any account.
 */
export type ResetVerdict = "send" | "quiet" | "held";

export async function reserveResetRequest(email: string, address: string, now = Date.now()): Promise<ResetVerdict> {
  const known = address !== UNKNOWN_ADDRESS;
  let verdict: ResetVerdict = "send";
  // Own keys, so reset requests and failed sign-ins never count against each other.
  await reserveAttempt(`reset:${email}`, `reset:${address}`, { since: now - RESET_WINDOW_MS, at: now }, (counts) => {
    if (counts.byAddress >= (known ? MAX_RESETS_PER_ADDRESS : SHARED_BUCKET_RESETS)) verdict = "held";
    else if (counts.byEmail >= MAX_RESETS_PER_EMAIL) verdict = "quiet";
    return verdict === "send";
  });
  return verdict;
}

/** Wrong or spent links a minute from one address before it is held (accepting, resetting). */
export const MAX_TOKEN_FAILURES_PER_ADDRESS = 20;
const SHARED_BUCKET_TOKEN_FAILURES = 100;

export const TOKEN_THROTTLED_MESSAGE = "Too many attempts with links that do not work. Wait a minute, then try again.";

/**
 * Counts one use of a mailed link before it is checked; null when the address is held. A token is
 * 256 random bits, so this is not what keeps it unguessable: it keeps a script from hammering the
 * password hashing behind it.
 */
export async function reserveTokenUse(
  kind: "invitation" | "reset",
  address: string,
  now = Date.now(),
): Promise<Reservation | null> {
  const limit = address === UNKNOWN_ADDRESS ? SHARED_BUCKET_TOKEN_FAILURES : MAX_TOKEN_FAILURES_PER_ADDRESS;
  const key = { email: `${kind}-link`, address: `${kind}-link:${address}` };
  const id = await reserveAttempt(
    key.email,
    key.address,
    { since: now - WINDOW_MS, at: now },
    (counts) => counts.byAddress < limit,
  );
  return id === null ? null : { ...key, id };
}

/** The link worked: its use is not a failure. */
export const releaseTokenUse = releaseSignIn;
