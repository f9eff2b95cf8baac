import { json, readJson, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { createInvitation, listClaimableAthletes, listInvitations } from "@/lib/data/invitations";
import { sendQueuedMail } from "@/lib/data/mail";
import { invitationCreateSchema } from "@/lib/validation/people";

export const GET = withApi(async () => {
  const actor = await guard({ roles: PEOPLE_ROLES });
  const [invitations, claimableAthletes] = await Promise.all([listInvitations(actor), listClaimableAthletes(actor)]);
  return json({ invitations, claimableAthletes });
});

export const POST = withApi(async (request) => {
  const actor = await guard({ roles: PEOPLE_ROLES });
  const input = await readJson(request, invitationCreateSchema);
  const invitation = await createInvitation(actor, input);
  void sendQueuedMail();
  return json({ invitation }, { status: 201 });
});
