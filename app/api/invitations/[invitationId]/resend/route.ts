import { json, parseId, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { resendInvitation } from "@/lib/data/invitations";
import { sendQueuedMail } from "@/lib/data/mail";

type Params = { invitationId: string };

/** A new link for the invitation: new token, 7 more days; the link in the earlier mail stops working. */
export const POST = withApi<Params>(async (_request, { params }) => {
  const invitationId = parseId((await params).invitationId, "Invitation");
  const actor = await guard({ roles: PEOPLE_ROLES });
  const invitation = await resendInvitation(actor, invitationId);
  void sendQueuedMail();
  return json({ invitation });
});
