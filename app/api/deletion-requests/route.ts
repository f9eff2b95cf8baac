import { json, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { DELETION_ROLES } from "@/lib/auth/permissions";
import { listDeletionRequests } from "@/lib/data/deletion-requests";

export const GET = withApi(async () => {
  const actor = await guard({ roles: DELETION_ROLES });
  return json({ requests: await listDeletionRequests(actor) });
});
