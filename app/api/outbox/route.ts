import { json, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { getOutbox } from "@/lib/data/outbox";

export const GET = withApi(async () => {
  const actor = await guard({ roles: PEOPLE_ROLES });
  return json(await getOutbox(actor));
});
