import { json, parseId, readJson, withApi } from "@/lib/api/handler";
import { guard, MANAGERS, STAFF } from "@/lib/auth/guard";
import { listSavedReports, saveReport } from "@/lib/data/reports";
import { savedReportCreateSchema } from "@/lib/validation/reports";

/** Saved reports of the squads in reach (`?squadId=` for one squad), newest first. */
export const GET = withApi(async (request) => {
  const raw = new URL(request.url).searchParams.get("squadId");
  const squadId = raw === null || raw === "" ? undefined : parseId(raw, "Squad");
  const actor = await guard({ roles: STAFF, squadId });
  return json({ reports: await listSavedReports(actor, { squadId }) });
});

/** Saves the report for these settings, recomputed on the server, with the scientist's note. */
export const POST = withApi(async (request) => {
  const actor = await guard({ roles: MANAGERS });
  const input = await readJson(request, savedReportCreateSchema);
  return json({ report: await saveReport(actor, input) }, { status: 201 });
});
