import { json, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { listMembers } from "@/lib/data/members";

export const GET = withApi(async () => {
  const actor = await guard({ roles: PEOPLE_ROLES });
  return json({ members: await listMembers(actor) });
});
