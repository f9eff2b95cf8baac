import { json, withApi } from "@/lib/api/handler";
import { guard, MANAGERS } from "@/lib/auth/guard";
import { getReliabilityReport } from "@/lib/data/reliability";
import { reliabilityQuerySchema, searchParamsObject } from "@/lib/validation/reports";

/** One test's reliability between two sessions of a squad: TE, CV%, change in mean, ICCs, Planner. */
export const GET = withApi(async (request) => {
  // Role first: coaches and athletes are refused before anything about the sessions is looked at.
  const actor = await guard({ roles: MANAGERS });
  const query = reliabilityQuerySchema.parse(searchParamsObject(new URL(request.url).searchParams));
  return json(await getReliabilityReport(actor, query));
});
