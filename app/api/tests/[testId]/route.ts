import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, MANAGERS } from "@/lib/auth/guard";
import { deleteOrArchiveTest, getTest, updateTest } from "@/lib/data/tests";
import { testUpdateSchema } from "@/lib/validation/tests";

type Params = { testId: string };

export const GET = withApi<Params>(async (_request, { params }) => {
  const testId = parseId((await params).testId, "Test");
  const actor = await guard({ testId });
  return json({ test: await getTest(actor, testId) });
});

export const PATCH = withApi<Params>(async (request, { params }) => {
  const testId = parseId((await params).testId, "Test");
  const actor = await guard({ roles: MANAGERS, testId });
  const input = await readJson(request, testUpdateSchema);
  return json({ test: await updateTest(actor, testId, input) });
});

export const DELETE = withApi<Params>(async (_request, { params }) => {
  const testId = parseId((await params).testId, "Test");
  const actor = await guard({ roles: MANAGERS, testId });
  return json(await deleteOrArchiveTest(actor, testId));
});
