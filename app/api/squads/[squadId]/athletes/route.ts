import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { addAthleteToSquad, listSquadAthletes } from "@/lib/data/athletes";
import { squadAthleteAddSchema } from "@/lib/validation/roster";

type Params = { squadId: string };

export const GET = withApi<Params>(async (request, { params }) => {
  const squadId = parseId((await params).squadId, "Squad");
  const actor = await guard({ roles: STAFF, squadId });
  const includeArchived = new URL(request.url).searchParams.get("archived") === "include";
  return json({ athletes: await listSquadAthletes(actor, squadId, { includeArchived }) });
});

export const POST = withApi<Params>(async (request, { params }) => {
  const squadId = parseId((await params).squadId, "Squad");
  const actor = await guard({ roles: STAFF, squadId });
  const input = await readJson(request, squadAthleteAddSchema);
  return json({ athlete: await addAthleteToSquad(actor, squadId, input) }, { status: 201 });
});
