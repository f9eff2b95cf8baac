import { json, parseId, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { listSessionAudit } from "@/lib/data/audit";

type Params = { sessionId: string };

export const GET = withApi<Params>(async (_request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  return json({ events: await listSessionAudit(actor, sessionId) });
});
