import { json, readJson, withApi } from "@/lib/api/handler";
import { guard, MANAGERS } from "@/lib/auth/guard";
import { createTest, listTests } from "@/lib/data/tests";
import { testCreateSchema } from "@/lib/validation/tests";

/** Every member of the organisation reads the test library; only owner and scientist change it. */
export const GET = withApi(async (request) => {
  const actor = await guard();
  const includeArchived = new URL(request.url).searchParams.get("archived") === "include";
  return json({ tests: await listTests(actor, { includeArchived }) });
});

export const POST = withApi(async (request) => {
  const actor = await guard({ roles: MANAGERS });
  const input = await readJson(request, testCreateSchema);
  return json({ test: await createTest(actor, input) }, { status: 201 });
});
