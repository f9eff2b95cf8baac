import { guard, STAFF } from "@/lib/auth/guard";
import { json, withApi } from "@/lib/api/handler";
import { listSquads } from "@/lib/data/squads";

export const GET = withApi(async (request) => {
  const actor = await guard({ roles: STAFF });
  const includeArchived = new URL(request.url).searchParams.get("archived") === "include";
  return json({ squads: await listSquads(actor, { includeArchived }) });
});
