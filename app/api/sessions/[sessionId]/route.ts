import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { deleteDraftSession } from "@/lib/data/session-delete";
import { getSessionSheet, updateSession } from "@/lib/data/sessions";
import { searchParamsObject } from "@/lib/validation/reports";
import { sessionDeleteQuerySchema, sessionUpdateSchema } from "@/lib/validation/sessions";

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

/** Deletes a draft made by mistake, if it still holds the number of results the caller confirmed. */
export const DELETE = withApi<Params>(async (request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  const { results } = sessionDeleteQuerySchema.parse(searchParamsObject(new URL(request.url).searchParams));
  return json(await deleteDraftSession(actor, sessionId, results));
});
