import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { writeResults } from "@/lib/data/results";
import { suspectsAmong } from "@/lib/data/suspects";
import { resultsBatchSchema } from "@/lib/validation/sessions";

type Params = { sessionId: string };

/**
 * Batch upsert from the Session sheet; every write carries the version it read. Suspect scores
 * (lib/suspect.ts) are saved like any other and listed in the answer.
 */
export const PUT = withApi<Params>(async (request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  const { results } = await readJson(request, resultsBatchSchema);
  const written = await writeResults(actor, sessionId, results);
  return json({ results: written, suspects: await suspectsAmong(actor.organizationId, sessionId, written) });
});
