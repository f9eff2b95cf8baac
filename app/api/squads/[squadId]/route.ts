import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, OWNERS, STAFF } from "@/lib/auth/guard";
import { getSquad, updateSquad } from "@/lib/data/squads";
import { squadUpdateSchema } from "@/lib/validation/roster";

type Params = { squadId: string };

export const GET = withApi<Params>(async (_request, { params }) => {
  const squadId = parseId((await params).squadId, "Squad");
  const actor = await guard({ roles: STAFF, squadId });
  return json(await getSquad(actor, squadId));
});

/** Renaming, archiving and assigning coaches belong to the owner. */
export const PATCH = withApi<Params>(async (request, { params }) => {
  const squadId = parseId((await params).squadId, "Squad");
  const actor = await guard({ roles: OWNERS, squadId });
  const input = await readJson(request, squadUpdateSchema);
  return json({ squad: await updateSquad(actor, squadId, input) });
});
