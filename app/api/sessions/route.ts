import { authorize, guard, STAFF } from "@/lib/auth/guard";
import { json, readJson, withApi } from "@/lib/api/handler";
import { createSession, listSessions } from "@/lib/data/sessions";
import { sessionCreateSchema } from "@/lib/validation/sessions";

export const GET = withApi(async (request) => {
  const raw = new URL(request.url).searchParams.get("squadId");
  const squadId = raw === null ? undefined : Number(raw);
  if (squadId !== undefined && !(Number.isSafeInteger(squadId) && squadId > 0)) return json({ sessions: [] });
  const actor = await guard({ roles: STAFF, ...(squadId ? { squadId } : {}) });
  return json({ sessions: await listSessions(actor, { squadId }) });
});

export const POST = withApi(async (request) => {
  const actor = await guard({ roles: STAFF });
  const input = await readJson(request, sessionCreateSchema);
  await authorize(actor, { squadId: input.squadId });
  return json({ session: await createSession(actor, input) }, { status: 201 });
});
