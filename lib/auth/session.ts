import "server-only";
import { getServerSession } from "next-auth";
import type { SessionClaims } from "@/lib/data/actors";
import { authOptions, claimsOf } from "./options";

export type { SessionClaims };

/**
 * The claims of the JWT session (user id and session version), or null. The only place that
 * reads the session; whether those claims are still current is the guard's question.
 */
export async function currentSession(): Promise<SessionClaims | null> {
  const session = await getServerSession(authOptions);
  const user = session?.user as { id?: string; sessionVersion?: unknown } | undefined;
  return user ? claimsOf({ sub: user.id, sv: user.sessionVersion }) : null;
}
