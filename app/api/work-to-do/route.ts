import { json, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getWorkToDo } from "@/lib/data/work-to-do";

/** The staff home's "What needs doing", in the caller's squads. */
export const GET = withApi(async () => {
  const actor = await guard({ roles: STAFF });
  return json(await getWorkToDo(actor));
});
