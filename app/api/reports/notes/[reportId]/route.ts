import { json, parseId, withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getSavedReport } from "@/lib/data/reports";

/** A saved report as it was saved, with `changedSince` when today's scores would differ. */
export const GET = withApi<{ reportId: string }>(async (_request, { params }) => {
  const reportId = parseId((await params).reportId, "Saved report");
  const actor = await guard({ roles: STAFF });
  return json({ report: await getSavedReport(actor, reportId) });
});
