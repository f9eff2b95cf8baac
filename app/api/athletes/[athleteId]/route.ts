import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getAthlete, updateAthlete } from "@/lib/data/athletes";
import { athleteUpdateSchema } from "@/lib/validation/roster";

type Params = { athleteId: string };

export const GET = withApi<Params>(async (_request, { params }) => {
  const athleteId = parseId((await params).athleteId, "Athlete");
  const actor = await guard({ roles: STAFF, athleteId });
  return json({ athlete: await getAthlete(actor, athleteId) });
});

export const PATCH = withApi<Params>(async (request, { params }) => {
  const athleteId = parseId((await params).athleteId, "Athlete");
  const actor = await guard({ roles: STAFF, athleteId });
  const input = await readJson(request, athleteUpdateSchema);
  await updateAthlete(actor, athleteId, input);
  return json({ athlete: await getAthlete(actor, athleteId) });
});
