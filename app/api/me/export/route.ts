import { json, withApi } from "@/lib/api/handler";
import { ATHLETES, guard } from "@/lib/auth/guard";
import { getMyExport } from "@/lib/data/my-export";
import { myExportCsv } from "@/lib/reports/my-export-csv";
import { myExportQuerySchema } from "@/lib/validation/me";
import { searchParamsObject } from "@/lib/validation/reports";

/** The athlete's data-rights export: profile and every result held about them, as a download. */
export const GET = withApi(async (request) => {
  const actor = await guard({ roles: ATHLETES });
  const { format } = myExportQuerySchema.parse(searchParamsObject(new URL(request.url).searchParams));
  const data = await getMyExport(actor);
  const name = `my-changewise-data-${data.exportedAt.slice(0, 10)}.${format}`;
  const headers = { "content-disposition": `attachment; filename="${name}"`, "cache-control": "no-store" };
  if (format === "json") return json(data, { headers });
  return new Response(myExportCsv(data), { headers: { ...headers, "content-type": "text/csv; charset=utf-8" } });
});
