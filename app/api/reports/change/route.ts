import { json, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getChangeReport } from "@/lib/data/reports";
import { changeReportQuerySchema, searchParamsObject } from "@/lib/validation/reports";

/** One test's change between two sessions of a squad: squad interval, athletes, exclusions. */
export const GET = withApi(async (request) => {
  // Role first: athletes are refused before anything about the sessions is looked at.
  const actor = await guard({ roles: STAFF });
  const query = changeReportQuerySchema.parse(searchParamsObject(new URL(request.url).searchParams));
  return json(await getChangeReport(actor, query));
});
