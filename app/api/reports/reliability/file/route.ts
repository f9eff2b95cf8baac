import { json, readJson, withApi } from "@/lib/api/handler";
import { guard, MANAGERS } from "@/lib/auth/guard";
import { getReliabilityFromFile } from "@/lib/data/reliability";
import { reliabilityFileSchema } from "@/lib/validation/reports";

/** The Reliability check of a two-trial file (the scores travel in the body and are not stored). */
export const POST = withApi(async (request) => {
  const actor = await guard({ roles: MANAGERS });
  const input = await readJson(request, reliabilityFileSchema);
  return json(await getReliabilityFromFile(actor, input));
});
