import { withApi } from "@/lib/api/handler";
import { guard, STAFF } from "@/lib/auth/guard";
import { getChangeReport } from "@/lib/data/reports";
import { changeReportCsv } from "@/lib/reports/change-report-csv";
import { changeReportQuerySchema, searchParamsObject } from "@/lib/validation/reports";

/** The Change report as a CSV download: the same query, the same numbers as the JSON. */
export const GET = withApi(async (request) => {
  const actor = await guard({ roles: STAFF });
  const query = changeReportQuerySchema.parse(searchParamsObject(new URL(request.url).searchParams));
  const report = await getChangeReport(actor, query);
  const name = `change-report-${report.test.name}-${report.sessions.from.date}-${report.sessions.to.date}`
    .toLowerCase()
    .replace(/[^a-z0-9-]+/g, "-");
  return new Response(changeReportCsv(report), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}.csv"`,
      "cache-control": "no-store",
    },
  });
});
