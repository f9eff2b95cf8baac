"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { LoadFailure } from "@/components/query-status";
import { reliabilityQueries, reliabilitySearch } from "@/lib/client/queries";
import { formatDate } from "@/lib/labels";
import type { ReliabilityQuery } from "@/lib/validation/reports";
import { AdoptTypicalError } from "./adopt-typical-error";
import { ReliabilityModes } from "./reliability-modes";
import { ReliabilitySettings } from "./reliability-settings";
import { ReliabilityCautions, StudyFigures } from "./study-figures";

/** The Reliability check: how noisy is this test, and can it see the smallest worthwhile change? */
export function ReliabilityCheck({ initial, canAdopt }: { initial: ReliabilityQuery; canAdopt: boolean }) {
  const [query, setQuery] = useState(initial);
  const study = useQuery({ ...reliabilityQueries.report(query), placeholderData: keepPreviousData });

  function change(next: ReliabilityQuery) {
    setQuery(next);
    // The URL holds the settings, so the check can be shared and reopened as it is.
    window.history.replaceState(null, "", `?${reliabilitySearch(next)}`);
  }

  const data = study.data;
  return (
    <section aria-labelledby="reliability-heading" className="space-y-4">
      <div>
        <h1 id="reliability-heading" className="text-2xl font-bold">
          Reliability check
        </h1>
        <p className="text-ink-soft">
          {data ? (
            <>
              <span className="font-semibold text-ink">{data.test.name}</span> · {data.sessions.first.squadName} ·{" "}
              {formatDate(data.sessions.first.date)} and {formatDate(data.sessions.second.date)}
            </>
          ) : (
            "Pick two sessions of the same athletes, a few days apart with no training between, and a test."
          )}
          {study.isFetching && <span role="status"> · updating…</span>}
        </p>
      </div>
      <ReliabilityModes current="sessions" />
      <ReliabilitySettings query={query} onChange={change} />
      {study.error && <LoadFailure failure="This check cannot be made" error={study.error} onRetry={study.refetch} />}
      {data && !study.error && (
        <>
          <StudyFigures report={data} plotKey={reliabilitySearch(query)} />
          {canAdopt && (
            <AdoptTypicalError
              report={data}
              source={{ firstSessionId: data.sessions.first.id, secondSessionId: data.sessions.second.id }}
            />
          )}
        </>
      )}
      <ReliabilityCautions />
    </section>
  );
}
