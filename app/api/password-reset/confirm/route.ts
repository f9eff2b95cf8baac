import { json, readJson, withApi } from "@/lib/api/handler";
import { clientAddress } from "@/lib/auth/client-address";
import { releaseTokenUse, reserveTokenUse, TOKEN_THROTTLED_MESSAGE } from "@/lib/auth/throttle";
import { confirmPasswordReset } from "@/lib/data/password-reset";
import { ApiError } from "@/lib/errors";
import { passwordResetConfirmSchema } from "@/lib/validation/people";

/** Public: the mailed token is the credential. Sets the password and ends every session of the account. */
export const POST = withApi(async (request) => {
  const input = await readJson(request, passwordResetConfirmSchema);
  const reservation = await reserveTokenUse("reset", clientAddress(Object.fromEntries(request.headers)));
  if (!reservation) throw new ApiError(429, "too_many_requests", TOKEN_THROTTLED_MESSAGE);
  const reset = await confirmPasswordReset(input);
  await releaseTokenUse(reservation);
  return json({ reset });
});
