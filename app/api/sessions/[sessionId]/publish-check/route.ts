import { json, parseId, withApi } from "@/lib/api/handler";
import { guard, PUBLISHERS } from "@/lib/auth/guard";
import { getPublishCheck } from "@/lib/data/publish-mail";

/** Before publishing (owner, scientist): which athletes will see their results and get mail, and why not. */
export const GET = withApi<{ sessionId: string }>(async (_request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: PUBLISHERS, sessionId });
  return json(await getPublishCheck(actor, sessionId));
});
