/**
 * What the Change report and Reliability check pages share: the search read from the URL, the
 * lists their settings pick from, the report prefetched (a 404 is the not-found page, a 422 is
 * shown by the screen beside its settings), and the card for a link that opens nothing.
 */
import type { QueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { notFound } from "next/navigation";
import { sessionQueries, squadQueries, testQueries } from "@/lib/client/queries";
import type { Actor } from "@/lib/data/actors";
import type { listSessions } from "@/lib/data/sessions";
import type { listSquads } from "@/lib/data/squads";
import { listTests } from "@/lib/data/tests";
import { ApiError } from "@/lib/errors";
import { prefetch } from "@/lib/query/prefetch";

export type Search = Record<string, string | string[] | undefined>;

/** The first value of each search parameter (a link may repeat one). */
export const firstValues = (search: Search) =>
  Object.fromEntries(Object.entries(search).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));

/** Prefetches the squads, sessions and tests the settings offer, and the report itself. */
export async function prefetchPairReport<T>(
  client: QueryClient,
  actor: Actor,
  lists: { squads: Awaited<ReturnType<typeof listSquads>>; sessions: Awaited<ReturnType<typeof listSessions>> },
  report: Parameters<typeof prefetch<T>>[1],
  load: () => Promise<T>,
) {
  await Promise.all([
    prefetch(client, squadQueries.list(), async () => lists.squads),
    prefetch(client, sessionQueries.list(), async () => lists.sessions),
    prefetch(client, testQueries.list({ archived: true }), () => listTests(actor, { includeArchived: true })),
  ]);
  try {
    await prefetch(client, report, load);
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) notFound();
    // A 422 (e.g. fewer than two athletes pair up) is shown by the screen, with its settings to change.
    if (!(error instanceof ApiError && error.status === 422)) throw error;
  }
}

export function PairReportUnavailable({
  title,
  message,
  links,
}: {
  title: string;
  message: string;
  links: { href: string; label: string }[];
}) {
  return (
    <div className="card mx-auto max-w-xl p-6">
      <h1 className="text-xl font-bold">{title}</h1>
      <p className="mt-2 text-ink-soft">{message}</p>
      <div className="mt-4 flex flex-wrap gap-2">
        {links.map((link) => (
          <Link key={link.href} href={link.href} className="btn-quiet">
            {link.label}
          </Link>
        ))}
      </div>
    </div>
  );
}

/** The message for a link whose settings do not parse. */
export const unreadableLink = (issues: { message: string }[]) =>
  `This link's settings cannot be read: ${issues.map((i) => i.message).join(" ")}`;
