import "server-only";
import { findUserCredentials } from "@/lib/data/sign-in";
import { signInSchema } from "@/lib/validation/auth";
import { hashPassword, verifyPassword } from "./password";
import { releaseSignIn, reserveSignIn, THROTTLED_MESSAGE } from "./throttle";

/** `sessionVersion` goes into the session token; see `sessionIsCurrent`. */
export type SignedInUser = { id: string; email: string; name: string; sessionVersion: number };

export class SignInError extends Error {}

// Unknown e-mails are checked against a throwaway hash so they cost the same time as known ones.
let dummyHash: Promise<string> | undefined;
const timingDummy = () => (dummyHash ??= hashPassword("not-a-real-password"));

/**
 * Checks e-mail and password with throttling per e-mail and per address.
 * Returns null for wrong credentials; throws SignInError when throttled.
 */
export async function authorizeCredentials(raw: unknown, address: string): Promise<SignedInUser | null> {
  const parsed = signInSchema.safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  // Counted before the check and kept as a failure unless the password is right.
  const reservation = await reserveSignIn(email, address);
  if (!reservation) throw new SignInError(THROTTLED_MESSAGE);
  const user = await findUserCredentials(email);
  const ok = await verifyPassword(password, user?.passwordHash ?? (await timingDummy()));
  if (!user?.passwordHash || !ok) return null;
  await releaseSignIn(reservation);
  return { id: String(user.id), email: user.email, name: user.name, sessionVersion: user.sessionVersion };
}
