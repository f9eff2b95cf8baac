import "server-only";
import { countRecentFailures, recordFailure } from "@/lib/data/sign-in";

/** Failures a minute before one account is held. */
export const MAX_FAILURES_PER_EMAIL = 5;
/**
 * Failures a minute before one address is held: higher, because a whole club often signs in
 * from one address (one NAT), and a few typos by different staff must not lock everyone out.
 */
export const MAX_FAILURES_PER_ADDRESS = 20;
const WINDOW_MS = 60_000;

export const THROTTLED_MESSAGE = "Too many failed sign-ins. Wait a minute, then try again.";

/** True when this e-mail or this address has failed too often in the last minute. */
export async function isThrottled(email: string, address: string, now = Date.now()): Promise<boolean> {
  const { byEmail, byAddress } = await countRecentFailures(email, address, now - WINDOW_MS);
  return byEmail >= MAX_FAILURES_PER_EMAIL || byAddress >= MAX_FAILURES_PER_ADDRESS;
}

export function noteFailure(email: string, address: string, now = Date.now()) {
  return recordFailure(email, address, now);
}
