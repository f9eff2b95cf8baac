import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { authorize, guard, STAFF } from "@/lib/auth/guard";
import { createSession, listSessions } from "@/lib/data/sessions";
import { sessionCreateSchema } from "@/lib/validation/sessions";

export const GET = withApi(async (request) => {
  const raw = new URL(request.url).searchParams.get("squadId");
  // The same rule as ids in the path: a malformed or unreachable squad is not found.
  const squadId = raw === null || raw === "" ? undefined : parseId(raw, "Squad");
  const actor = await guard({ roles: STAFF, squadId });
  return json({ sessions: await listSessions(actor, { squadId }) });
});

export const POST = withApi(async (request) => {
  const actor = await guard({ roles: STAFF });
  const input = await readJson(request, sessionCreateSchema);
  await authorize(actor, { squadId: input.squadId });
  return json({ session: await createSession(actor, input) }, { status: 201 });
});
