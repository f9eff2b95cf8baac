import { json, readJson, withApi } from "@/lib/api/handler";
import { guard, OWNERS, STAFF } from "@/lib/auth/guard";
import { createSquad, listSquads } from "@/lib/data/squads";
import { squadCreateSchema } from "@/lib/validation/roster";

export const GET = withApi(async (request) => {
  const actor = await guard({ roles: STAFF });
  const includeArchived = new URL(request.url).searchParams.get("archived") === "include";
  return json({ squads: await listSquads(actor, { includeArchived }) });
});

export const POST = withApi(async (request) => {
  const actor = await guard({ roles: OWNERS });
  const input = await readJson(request, squadCreateSchema);
  return json({ squad: await createSquad(actor, input) }, { status: 201 });
});
