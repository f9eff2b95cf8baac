import { json, readJson, withApi } from "@/lib/api/handler";
import { clientAddress } from "@/lib/auth/client-address";
import { reserveResetRequest } from "@/lib/auth/throttle";
import { sendQueuedMail } from "@/lib/data/mail";
import { RESET_MINUTES, requestPasswordReset } from "@/lib/data/password-reset";
import { ApiError } from "@/lib/errors";
import { passwordResetRequestSchema } from "@/lib/validation/people";

/** The one answer, whether or not the address has an account (and whether or not a mail went). */
const RESET_REQUESTED = {
  requested: true,
  message: `If that address belongs to a Changewise account, a link to choose a new password is on its way. It works once, for ${RESET_MINUTES} minutes.`,
};

/** Public: asking for a reset link. */
export const POST = withApi(async (request) => {
  const { email } = await readJson(request, passwordResetRequestSchema);
  const verdict = await reserveResetRequest(email, clientAddress(Object.fromEntries(request.headers)));
  if (verdict === "held")
    throw new ApiError(429, "too_many_requests", "Too many reset requests from here. Wait a quarter of an hour.");
  if (verdict === "send" && (await requestPasswordReset(email))) void sendQueuedMail();
  return json(RESET_REQUESTED, { status: 202 });
});
