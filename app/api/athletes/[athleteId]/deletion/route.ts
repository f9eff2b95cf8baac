import { json, parseId, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { DELETION_ROLES } from "@/lib/auth/permissions";
import { previewAthleteDeletion } from "@/lib/data/athlete-deletion";

type Params = { athleteId: string };

/** What `DELETE /api/athletes/[id]` would remove, counted, for the confirmation dialog. */
export const GET = withApi<Params>(async (_request, { params }) => {
  const athleteId = parseId((await params).athleteId, "Athlete");
  const actor = await guard({ roles: DELETION_ROLES, athleteId });
  return json(await previewAthleteDeletion(actor, athleteId));
});
