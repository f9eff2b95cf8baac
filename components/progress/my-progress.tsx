"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { athleteQueries } from "@/lib/client/queries";
import { AskForDeletion } from "./ask-for-deletion";
import { ProgressTestCard } from "./progress-test-card";

/** My progress: consent first, then one card per test, then the athlete's own data to take away. */
export function MyProgress() {
  const { data } = useSuspenseQuery(athleteQueries.myProgress());
  return (
    <div className="space-y-4">
      {!data.consent.ok ? (
        <div className="card space-y-2 p-4">
          <h2 className="text-lg font-bold">Your results are waiting for consent</h2>
          <p>
            Your club has not recorded your consent yet
            {data.consent.missing.includes("guardian")
              ? data.consent.missing.includes("athlete")
                ? ", nor — as you are under 18 — a parent's or guardian's"
                : ": as you are under 18, a parent's or guardian's consent is needed too"
              : ""}
            . Until it does, your results are not shown here and no results mail is sent to you.
          </p>
          <p className="text-ink-soft">Ask your coach or the club&apos;s staff how to give it.</p>
        </div>
      ) : data.tests.length === 0 ? (
        <p className="card p-6 text-ink-soft">No published results yet.</p>
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            Each change is from your previous score in the same test. Where the test&apos;s noise (its typical error) is
            known, the change comes with a {Math.round(data.confidence * 100)} % interval for your true change, read
            against the smallest change that matters.
          </p>
          {data.tests.map((test) => (
            <ProgressTestCard key={test.id} test={test} confidence={data.confidence} minSquad={data.minSquad} />
          ))}
        </>
      )}
      <div className="card space-y-2 p-4">
        <h2 className="text-lg font-bold">Your data</h2>
        <p className="text-sm">
          Download everything your club holds about you: your profile and every result recorded for you, including
          sessions not published yet (each marked with its status).
        </p>
        <p className="flex flex-wrap gap-2">
          <a className="btn-quiet" href="/api/me/export?format=csv" download>
            Download as CSV
          </a>
          <a className="btn-quiet" href="/api/me/export?format=json" download>
            Download as JSON
          </a>
        </p>
        <AskForDeletion />
      </div>
    </div>
  );
}
