import { json, parseId, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { undoLastChange } from "@/lib/data/undo";

type Params = { sessionId: string };

export const POST = withApi<Params>(async (_request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  return json({ undone: await undoLastChange(actor, sessionId) });
});
