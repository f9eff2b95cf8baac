import "server-only";
import { getServerSession } from "next-auth";
import { authOptions } from "./options";

/** The signed-in user's id from the JWT session, or null. The only place that reads the session. */
export async function currentUserId(): Promise<number | null> {
  const session = await getServerSession(authOptions);
  const id = Number((session?.user as { id?: string } | undefined)?.id);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}
