import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { writeResults } from "@/lib/data/results";
import { resultsBatchSchema } from "@/lib/validation/sessions";

type Params = { sessionId: string };

/** Batch upsert from the Session sheet; every write carries the version it read. */
export const PUT = withApi<Params>(async (request, { params }) => {
  const sessionId = parseId((await params).sessionId, "Session");
  const actor = await guard({ roles: STAFF, sessionId });
  const { results } = await readJson(request, resultsBatchSchema);
  return json({ results: await writeResults(actor, sessionId, results) });
});
