import { json, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";

export const GET = withApi(async () => {
  const actor = await guard();
  return json({
    user: { id: actor.userId, email: actor.email, name: actor.name },
    organization: { id: actor.organizationId, name: actor.organizationName },
    role: actor.role,
    athleteId: actor.athleteId,
  });
});
