"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import Link from "next/link";
import { changeReportSearch, squadQueries, type WorkToDo } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS } from "@/lib/labels";

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The staff home's "What needs doing": scores still to enter, comparisons ready, tests without a typical error. */
export function WorkToDoPanel() {
  const { data } = useSuspenseQuery(squadQueries.workToDo());
  const nothing =
    data.missingScores.length === 0 && data.comparisons.length === 0 && data.testsWithoutTypicalError.length === 0;
  return (
    <section aria-labelledby="todo-heading" className="card space-y-3 p-4">
      <h2 id="todo-heading" className="text-lg font-bold">
        What needs doing
      </h2>
      {nothing ? (
        <p className="text-sm text-ink-soft">Nothing waiting: every draft is complete and every test has its noise.</p>
      ) : (
        <div className="grid gap-4 lg:grid-cols-3">
          <MissingScores items={data.missingScores} />
          <Comparisons items={data.comparisons} />
          <Untested items={data.testsWithoutTypicalError} />
        </div>
      )}
    </section>
  );
}

function MissingScores({ items }: { items: WorkToDo["missingScores"] }) {
  return (
    <div>
      <h3 className="font-semibold">Scores missing in drafts</h3>
      {items.length === 0 ? (
        <p className="text-sm text-ink-soft">Every draft session is complete.</p>
      ) : (
        <ul className="mt-1 space-y-2 text-sm">
          {items.map((s) => {
            const more = s.athletes - s.names.length;
            return (
              <li key={s.sessionId}>
                <Link href={`/sessions/${s.sessionId}`} className="font-semibold underline underline-offset-2">
                  {s.squadName} · {PHASE_LABELS[s.phase]} {formatDate(s.date)}
                </Link>
                <span className="block text-ink-soft">
                  <span className="num">{plural(s.missing, "score")}</span> missing for {s.names.join(", ")}
                  {more > 0 ? ` and ${plural(more, "other")}` : ""}
                </span>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}

function Comparisons({ items }: { items: WorkToDo["comparisons"] }) {
  return (
    <div>
      <h3 className="font-semibold">Ready to compare</h3>
      {items.length === 0 ? (
        <p className="text-sm text-ink-soft">No squad has a pre-block and post-block session with scores to pair.</p>
      ) : (
        <ul className="mt-1 space-y-2 text-sm">
          {items.map((c) => (
            <li key={`${c.fromSessionId}:${c.toSessionId}`}>
              <Link
                href={`/reports/change?${changeReportSearch({ ...c, confidence: 0.9 })}`}
                className="font-semibold underline underline-offset-2"
              >
                {c.squadName}: {c.testName}
              </Link>
              <span className="block text-ink-soft">
                Pre-block {formatDate(c.fromDate)} → post-block {formatDate(c.toDate)},{" "}
                <span className="num">{plural(c.paired, "athlete")}</span> with both scores
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function Untested({ items }: { items: WorkToDo["testsWithoutTypicalError"] }) {
  return (
    <div>
      <h3 className="font-semibold">Tests without a typical error</h3>
      {items.length === 0 ? (
        <p className="text-sm text-ink-soft">Every test in your sessions has a typical error.</p>
      ) : (
        <>
          <p className="text-sm text-ink-soft">Without it, no athlete&apos;s change gets an interval or a verdict.</p>
          <ul className="mt-1 space-y-1 text-sm">
            {items.map((t) => (
              <li key={t.id}>
                <Link href={`/reports/reliability?testId=${t.id}`} className="underline underline-offset-2">
                  {t.name}
                </Link>
              </li>
            ))}
          </ul>
        </>
      )}
    </div>
  );
}
