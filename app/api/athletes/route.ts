import { json, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { listAthletes } from "@/lib/data/athletes";

/** Owner and scientist: the organisation; coach: their squads; athlete: only themself. */
export const GET = withApi(async (request) => {
  const actor = await guard();
  const includeArchived = new URL(request.url).searchParams.get("archived") === "include";
  return json({ athletes: await listAthletes(actor, { includeArchived }) });
});
