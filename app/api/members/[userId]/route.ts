import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { PEOPLE_ROLES } from "@/lib/auth/permissions";
import { getMember, removeMember, updateMemberRole } from "@/lib/data/members";
import { memberUpdateSchema } from "@/lib/validation/people";

type Params = { userId: string };

export const GET = withApi<Params>(async (_request, { params }) => {
  const userId = parseId((await params).userId, "Member");
  const actor = await guard({ roles: PEOPLE_ROLES });
  return json({ member: await getMember(actor, userId) });
});

export const PATCH = withApi<Params>(async (request, { params }) => {
  const userId = parseId((await params).userId, "Member");
  const actor = await guard({ roles: PEOPLE_ROLES });
  const input = await readJson(request, memberUpdateSchema);
  return json({ member: await updateMemberRole(actor, userId, input) });
});

/** Removes the member from the organisation and ends their sessions; never the last owner. */
export const DELETE = withApi<Params>(async (_request, { params }) => {
  const userId = parseId((await params).userId, "Member");
  const actor = await guard({ roles: PEOPLE_ROLES });
  return json({ removed: await removeMember(actor, userId) });
});
