import { countRecentFailures, recordFailure } from "@/lib/data/sign-in";

export const MAX_FAILURES_PER_WINDOW = 5;
export const WINDOW_MS = 60_000;

export const THROTTLED_MESSAGE = "Too many failed sign-ins. Wait a minute, then try again.";

/** True when this e-mail or this address has failed too often in the last minute. */
export async function isThrottled(email: string, address: string, now = Date.now()): Promise<boolean> {
  const { byEmail, byAddress } = await countRecentFailures(email, address, now - WINDOW_MS);
  return byEmail >= MAX_FAILURES_PER_WINDOW || byAddress >= MAX_FAILURES_PER_WINDOW;
}

export function noteFailure(email: string, address: string, now = Date.now()) {
  return recordFailure(email, address, now);
}
