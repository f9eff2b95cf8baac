import { json, parseId, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { revokeInvitation } from "@/lib/data/invitations";

type Params = { invitationId: string };

export const DELETE = withApi<Params>(async (_request, { params }) => {
  const invitationId = parseId((await params).invitationId, "Invitation");
  const actor = await guard({ roles: PEOPLE_ROLES });
  return json({ revoked: await revokeInvitation(actor, invitationId) });
});
