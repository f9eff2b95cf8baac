import { json, withApi } from "@/lib/api/handler";
import { ATHLETES, guard } from "@/lib/auth/guard";
import { getMyProgress } from "@/lib/data/my-progress";

/** My progress (athletes): their own tests over published sessions, changes and verdicts. */
export const GET = withApi(async () => {
  const actor = await guard({ roles: ATHLETES });
  return json(await getMyProgress(actor));
});
