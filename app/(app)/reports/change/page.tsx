import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { ChangeReport } from "@/components/report/change-report";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";
import { canWriteInterpretation } from "@/lib/auth/permissions";
import { changeReportSearch, reportQueries } from "@/lib/client/queries";
import { getChangeReport } from "@/lib/data/reports";
import { listSessions } from "@/lib/data/sessions";
import { listSquads } from "@/lib/data/squads";
import { serverQueryClient } from "@/lib/query/prefetch";
import { defaultComparison } from "@/lib/reports/defaults";
import { changeReportQuerySchema } from "@/lib/validation/reports";
import {
  firstValues,
  PairReportUnavailable,
  prefetchPairReport,
  type Search,
  unreadableLink,
} from "../_shared/pair-report-page";

export const metadata: Metadata = { title: "Change report" };

const unavailable = (message: string) => (
  <PairReportUnavailable
    title="Change report"
    message={message}
    links={[
      { href: "/reports/change", label: "Open the latest comparison" },
      { href: "/sessions", label: "Sessions" },
    ]}
  />
);

export default async function ChangeReportPage({ searchParams }: { searchParams: Promise<Search> }) {
  const actor = await pageGuard({ roles: STAFF });
  const search = firstValues(await searchParams);
  const [squads, sessions] = await Promise.all([listSquads(actor), listSessions(actor)]);

  const parsed = changeReportQuerySchema.safeParse(search);
  if (!parsed.success) {
    // A link without settings opens on the squad's latest pre/post pair; a broken one says what is wrong.
    if (search.testId === undefined && search.fromSessionId === undefined) {
      const asked = Number(search.squadId);
      const order = squads.some((s) => s.id === asked) ? [asked] : squads.map((s) => s.id);
      for (const squadId of order) {
        const pick = defaultComparison(sessions, squadId);
        if (pick) redirect(`/reports/change?${changeReportSearch({ ...pick, confidence: 0.9 })}`);
      }
      return unavailable("No squad of yours has two sessions that measured the same test yet.");
    }
    return unavailable(unreadableLink(parsed.error.issues));
  }

  const client = serverQueryClient();
  await prefetchPairReport(client, actor, { squads, sessions }, reportQueries.change(parsed.data), () =>
    getChangeReport(actor, parsed.data),
  );
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <ChangeReport initial={parsed.data} canWriteNote={canWriteInterpretation(actor)} />
    </HydrationBoundary>
  );
}
