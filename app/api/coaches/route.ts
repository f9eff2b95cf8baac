import { json, withApi } from "@/lib/api/handler";
import { guard, MANAGERS } from "@/lib/auth/guard";
import { listCoaches } from "@/lib/data/squads";

export const GET = withApi(async () => {
  const actor = await guard({ roles: MANAGERS });
  return json({ coaches: await listCoaches(actor) });
});
