import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { ReliabilityCheck } from "@/components/reliability/reliability-check";
import { pageGuard } from "@/lib/auth/page-guard";
import { canRunReliability, RELIABILITY_ROLES } from "@/lib/auth/permissions";
import { reliabilityQueries, reliabilitySearch } from "@/lib/client/queries";
import { getReliabilityReport } from "@/lib/data/reliability";
import { listSessions } from "@/lib/data/sessions";
import { listSquads } from "@/lib/data/squads";
import { serverQueryClient } from "@/lib/query/prefetch";
import { defaultReliabilityPair } from "@/lib/reports/defaults";
import { reliabilityQuerySchema } from "@/lib/validation/reports";
import {
  firstValues,
  PairReportUnavailable,
  prefetchPairReport,
  type Search,
  unreadableLink,
} from "../_shared/pair-report-page";

export const metadata: Metadata = { title: "Reliability check" };

const unavailable = (message: string) => (
  <PairReportUnavailable
    title="Reliability check"
    message={message}
    links={[
      { href: "/reports/reliability", label: "Open the latest test–retest pair" },
      { href: "/reports/reliability/file", label: "Check a two-trial file" },
      { href: "/sessions", label: "Sessions" },
    ]}
  />
);

export default async function ReliabilityPage({ searchParams }: { searchParams: Promise<Search> }) {
  const actor = await pageGuard({ roles: RELIABILITY_ROLES });
  const search = firstValues(await searchParams);
  const [squads, sessions] = await Promise.all([listSquads(actor), listSessions(actor)]);

  const parsed = reliabilityQuerySchema.safeParse(search);
  if (!parsed.success) {
    // A link without settings opens on the latest baseline/retest pair; a broken one says what is wrong.
    if (search.testId === undefined && search.firstSessionId === undefined) {
      const pick = defaultReliabilityPair(sessions);
      if (pick) redirect(`/reports/reliability?${reliabilitySearch({ ...pick, confidence: 0.95 })}`);
      return unavailable("No squad has two sessions that measured the same test yet.");
    }
    return unavailable(unreadableLink(parsed.error.issues));
  }

  const client = serverQueryClient();
  await prefetchPairReport(client, actor, { squads, sessions }, reliabilityQueries.report(parsed.data), () =>
    getReliabilityReport(actor, parsed.data),
  );
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <ReliabilityCheck initial={parsed.data} canAdopt={canRunReliability(actor)} />
    </HydrationBoundary>
  );
}
