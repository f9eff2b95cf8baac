import { json, parseId, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getAthleteHistory } from "@/lib/data/athlete-history";

/** Athlete history (staff): every test over time with the change between consecutive scores. */
export const GET = withApi<{ athleteId: string }>(async (_request, { params }) => {
  const athleteId = parseId((await params).athleteId, "Athlete");
  const actor = await guard({ roles: STAFF, athleteId });
  return json(await getAthleteHistory(actor, athleteId));
});
