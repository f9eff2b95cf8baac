import { json, parseId, withApi } from "@/lib/api/handler";
import { guard } from "@/lib/auth/guard";
import { listAthleteResults } from "@/lib/data/athlete-results";

export const GET = withApi<{ athleteId: string }>(async (_request, { params }) => {
  const athleteId = parseId((await params).athleteId, "Athlete");
  const actor = await guard({ athleteId });
  return json({ results: await listAthleteResults(actor, athleteId) });
});
