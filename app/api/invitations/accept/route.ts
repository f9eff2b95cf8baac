import { json, readJson, withApi } from "@/lib/api/handler";
import { clientAddress } from "@/lib/auth/client-address";
import { releaseTokenUse, reserveTokenUse, TOKEN_THROTTLED_MESSAGE } from "@/lib/auth/throttle";
import { acceptInvitation } from "@/lib/data/invitations";
import { ApiError } from "@/lib/errors";
import { invitationAcceptSchema } from "@/lib/validation/people";

/**
 * Public: the invitation's token is the credential, so there is no guard; links that do not work
 * are counted per address instead. The answer names the address to sign in with.
 */
export const POST = withApi(async (request) => {
  const input = await readJson(request, invitationAcceptSchema);
  const reservation = await reserveTokenUse("invitation", clientAddress(Object.fromEntries(request.headers)));
  if (!reservation) throw new ApiError(429, "too_many_requests", TOKEN_THROTTLED_MESSAGE);
  const accepted = await acceptInvitation(input);
  await releaseTokenUse(reservation);
  return json({ accepted }, { status: 201 });
});
