import { json, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { getCapturedMessage } from "@/lib/data/outbox";

type Params = { messageId: string };

/** One message the local mail fake captured (its file name is the id). */
export const GET = withApi<Params>(async (_request, { params }) => {
  const actor = await guard({ roles: PEOPLE_ROLES });
  return json({ message: await getCapturedMessage(actor, (await params).messageId) });
});
