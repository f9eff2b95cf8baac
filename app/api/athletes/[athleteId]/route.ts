import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { DELETION_ROLES } from "@/lib/auth/permissions";
import { deleteAthlete } from "@/lib/data/athlete-deletion";
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

/** Deletes the athlete and every row that refers to them, for real (owner). */
export const DELETE = withApi<Params>(async (_request, { params }) => {
  const athleteId = parseId((await params).athleteId, "Athlete");
  const actor = await guard({ roles: DELETION_ROLES, athleteId });
  return json({ deleted: await deleteAthlete(actor, athleteId) });
});
