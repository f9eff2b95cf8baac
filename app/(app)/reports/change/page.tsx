import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { ChangeReport } from "@/components/report/change-report";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";
import { canWriteInterpretation } from "@/lib/auth/permissions";
import { changeReportSearch, reportQueries, sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { getChangeReport } from "@/lib/data/reports";
import { listSessions } from "@/lib/data/sessions";
import { listSquads } from "@/lib/data/squads";
import { listTests } from "@/lib/data/tests";
import { ApiError } from "@/lib/errors";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";
import { defaultComparison } from "@/lib/reports/defaults";
import { changeReportQuerySchema } from "@/lib/validation/reports";

export const metadata: Metadata = { title: "Change report" };

type Search = Record<string, string | string[] | undefined>;
const first = (search: Search) =>
  Object.fromEntries(Object.entries(search).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));

export default async function ChangeReportPage({ searchParams }: { searchParams: Promise<Search> }) {
  const actor = await pageGuard({ roles: STAFF });
  const search = first(await searchParams);
  const client = serverQueryClient();
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
      return <Empty message="No squad of yours has two sessions that measured the same test yet." />;
    }
    return (
      <Empty message={`This link's settings cannot be read: ${parsed.error.issues.map((i) => i.message).join(" ")}`} />
    );
  }

  await Promise.all([
    prefetch(client, squadQueries.list(), async () => squads),
    prefetch(client, sessionQueries.list(), async () => sessions),
    prefetch(client, testQueries.list({ archived: true }), () => listTests(actor, { includeArchived: true })),
  ]);
  try {
    await prefetch(client, reportQueries.change(parsed.data), () => getChangeReport(actor, parsed.data));
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) notFound();
    // A 422 (e.g. fewer than two athletes pair up) is shown by the screen, with its settings to change.
    if (!(error instanceof ApiError && error.status === 422)) throw error;
  }
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <ChangeReport initial={parsed.data} canWriteNote={canWriteInterpretation(actor)} />
    </HydrationBoundary>
  );
}

function Empty({ message }: { message: string }) {
  return (
    <div className="card mx-auto max-w-xl p-6">
      <h1 className="text-xl font-bold">Change report</h1>
      <p className="mt-2 text-ink-soft">{message}</p>
      <div className="mt-4 flex gap-2">
        <Link href="/reports/change" className="btn-quiet">
          Open the latest comparison
        </Link>
        <Link href="/sessions" className="btn-quiet">
          Sessions
        </Link>
      </div>
    </div>
  );
}
