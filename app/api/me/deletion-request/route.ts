import { json, readJson, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { DELETION_REQUEST_ROLES } from "@/lib/auth/permissions";
import { requestDeletion } from "@/lib/data/deletion-requests";
import { sendQueuedMail } from "@/lib/data/mail";
import { deletionRequestSchema } from "@/lib/validation/people";

/** The signed-in athlete asks for their record to be deleted: 201 the first time, 200 with the same request after. */
export const POST = withApi(async (request) => {
  const actor = await guard({ roles: DELETION_REQUEST_ROLES });
  const input = await readJson(request, deletionRequestSchema);
  const { request: saved, created } = await requestDeletion(actor, input);
  if (created) void sendQueuedMail();
  return json({ request: saved, created }, { status: created ? 201 : 200 });
});
