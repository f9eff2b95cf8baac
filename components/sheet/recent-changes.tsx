"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { type AuditEvent, sessionQueries } from "@/lib/client/queries";
import type { SheetAuditAction } from "@/lib/domain";
import { describeEntry, timeWords } from "@/lib/sheet/model";

const ACTION_WORDS: Record<Exclude<SheetAuditAction, "results.import">, string> = {
  "result.create": "entered",
  "result.update": "changed",
  "result.undo": "undid a change to",
};

function EventText({ e }: { e: AuditEvent }) {
  if (e.action === "results.import") {
    const rows = e.details?.rows;
    return (
      <>
        <span className="font-semibold">{e.actorName ?? "Someone"}</span> imported{" "}
        {rows !== undefined ? <span className="num">{rows}</span> : "the"} rows
        {e.details?.filename ? ` from ${e.details.filename}` : ""}
      </>
    );
  }
  return (
    <>
      <span className="font-semibold">{e.actorName ?? "Someone"}</span> {ACTION_WORDS[e.action]}{" "}
      {e.athleteName ?? "an athlete"} · {e.testName ?? "a test"}:{" "}
      <span className={`num ${e.undone ? "line-through" : ""}`}>
        {describeEntry(e.before, e.decimals)} → {describeEntry(e.after, e.decimals)}
      </span>
    </>
  );
}

/** The latest changes to this session's scores, newest first: who, when, old → new. */
export function RecentChanges({ sessionId }: { sessionId: number }) {
  const { data: events, refetch, isRefetching } = useSuspenseQuery(sessionQueries.audit(sessionId));
  return (
    <section aria-labelledby="changes-heading" className="card p-4">
      <div className="mb-2 flex items-baseline justify-between">
        <h2 id="changes-heading" className="font-bold">
          Recent changes
        </h2>
        <button
          type="button"
          className="text-xs font-semibold text-ink-soft hover:text-ink"
          disabled={isRefetching}
          onClick={() => refetch()}
        >
          {isRefetching ? "Refreshing…" : "Refresh"}
        </button>
      </div>
      {events.length === 0 && <p className="text-sm text-ink-soft">No changes recorded yet.</p>}
      {events.length > 0 && (
        <ol
          // A list that scrolls on its own takes focus, so the keyboard can scroll it too (WCAG 2.1.1).
          // biome-ignore lint/a11y/noNoninteractiveTabindex: a scrollable region must be focusable
          tabIndex={0}
          aria-labelledby="changes-heading"
          className="max-h-80 divide-y divide-line overflow-y-auto text-sm"
        >
          {events.map((e) => (
            <li key={e.id} className={`grid grid-cols-[6.5rem_1fr] gap-x-3 py-1.5 ${e.undone ? "text-ink-faint" : ""}`}>
              <span className="num text-ink-faint">{timeWords(e.at)}</span>
              <span>
                <EventText e={e} />
                {e.undone && <span className="ml-2 rounded bg-steady-soft px-1.5 text-xs text-ink-soft">undone</span>}
              </span>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
