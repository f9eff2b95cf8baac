import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { ReliabilityCheck } from "@/components/reliability/reliability-check";
import { pageGuard } from "@/lib/auth/page-guard";
import { canRunReliability, RELIABILITY_ROLES } from "@/lib/auth/permissions";
import { reliabilityQueries, reliabilitySearch, sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import { getReliabilityReport } from "@/lib/data/reliability";
import { listSessions } from "@/lib/data/sessions";
import { listSquads } from "@/lib/data/squads";
import { listTests } from "@/lib/data/tests";
import { ApiError } from "@/lib/errors";
import { prefetch, serverQueryClient } from "@/lib/query/prefetch";
import { defaultReliabilityPair } from "@/lib/reports/defaults";
import { reliabilityQuerySchema } from "@/lib/validation/reports";

export const metadata: Metadata = { title: "Reliability check" };

type Search = Record<string, string | string[] | undefined>;
const first = (search: Search) =>
  Object.fromEntries(Object.entries(search).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));

export default async function ReliabilityPage({ searchParams }: { searchParams: Promise<Search> }) {
  const actor = await pageGuard({ roles: RELIABILITY_ROLES });
  const search = first(await searchParams);
  const client = serverQueryClient();
  const [squads, sessions] = await Promise.all([listSquads(actor), listSessions(actor)]);

  const parsed = reliabilityQuerySchema.safeParse(search);
  if (!parsed.success) {
    // A link without settings opens on the latest baseline/retest pair; a broken one says what is wrong.
    if (search.testId === undefined && search.firstSessionId === undefined) {
      const pick = defaultReliabilityPair(sessions);
      if (pick) redirect(`/reports/reliability?${reliabilitySearch({ ...pick, confidence: 0.95 })}`);
      return <Empty message="No squad has two sessions that measured the same test yet." />;
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
    await prefetch(client, reliabilityQueries.report(parsed.data), () => getReliabilityReport(actor, parsed.data));
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) notFound();
    // A 422 (e.g. fewer than two athletes pair up) is shown by the screen, with its settings to change.
    if (!(error instanceof ApiError && error.status === 422)) throw error;
  }
  return (
    <HydrationBoundary state={dehydrate(client)}>
      <ReliabilityCheck initial={parsed.data} canAdopt={canRunReliability(actor)} />
    </HydrationBoundary>
  );
}

function Empty({ message }: { message: string }) {
  return (
    <div className="card mx-auto max-w-xl p-6">
      <h1 className="text-xl font-bold">Reliability check</h1>
      <p className="mt-2 text-ink-soft">{message}</p>
      <div className="mt-4 flex flex-wrap gap-2">
        <Link href="/reports/reliability" className="btn-quiet">
          Open the latest test–retest pair
        </Link>
        <Link href="/reports/reliability/file" className="btn-quiet">
          Check a two-trial file
        </Link>
        <Link href="/sessions" className="btn-quiet">
          Sessions
        </Link>
      </div>
    </div>
  );
}
