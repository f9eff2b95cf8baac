import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, MANAGERS } from "@/lib/auth/guard";
import { adoptTypicalError } from "@/lib/data/reliability";
import { typicalErrorAdoptSchema } from "@/lib/validation/reports";

type Params = { testId: string };

/** Adopts the typical error measured between two sessions as the test's own (recomputed here). */
export const POST = withApi<Params>(async (request, { params }) => {
  const testId = parseId((await params).testId, "Test");
  const actor = await guard({ roles: MANAGERS, testId });
  const input = await readJson(request, typicalErrorAdoptSchema);
  return json({ test: await adoptTypicalError(actor, testId, input) });
});
