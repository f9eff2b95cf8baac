import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getSessionSheet, updateSession } from "@/lib/data/sessions";
import { sessionUpdateSchema } from "@/lib/validation/sessions";

type Params = { sessionId: string };

export const GET = withApi<Params>(async (_request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  return json(await getSessionSheet(actor, sessionId));
});

export const PATCH = withApi<Params>(async (request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  const input = await readJson(request, sessionUpdateSchema);
  return json({ session: await updateSession(actor, sessionId, input) });
});
