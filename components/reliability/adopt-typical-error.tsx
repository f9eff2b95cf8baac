"use client";

import { useAdoptTypicalError } from "@/hooks/use-writes";
import type { ReliabilityStudy } from "@/lib/client/queries";
import type { TypicalErrorAdoptInput } from "@/lib/validation/reports";
import { plain } from "@/lib/words/report";

/** Makes the measured typical error the test's own (the server recomputes the study first). */
export function AdoptTypicalError({ report, source }: { report: ReliabilityStudy; source: TypicalErrorAdoptInput }) {
  const adopt = useAdoptTypicalError();
  const { test } = report;
  const d = test.decimals + 1;
  const adopted = adopt.data;
  return (
    <section aria-labelledby="adopt-heading" className="card p-4">
      <h2 id="adopt-heading" className="text-lg font-bold">
        The test&apos;s typical error
      </h2>
      <p className="text-sm">
        Now in the Test library:{" "}
        <span className="num font-semibold">
          {test.typicalError === null ? "none" : `${plain(test.typicalError, d)} ${test.unit}`}
        </span>
        {test.typicalErrorDf !== null && ` (df ${test.typicalErrorDf})`}
        {test.typicalErrorSource && ` · ${test.typicalErrorSource}`}
      </p>
      <p className="text-sm">
        Measured here:{" "}
        <span className="num font-semibold">
          {plain(report.typicalError, d)} {test.unit}
        </span>{" "}
        (df {report.df}). Adopting it sets the individual intervals of every Change report of this test.
      </p>
      <button
        type="button"
        className="btn-primary mt-2"
        disabled={adopt.isPending}
        onClick={() =>
          adopt.mutate({
            testId: test.id,
            input: source,
          })
        }
      >
        {adopt.isPending ? "Adopting…" : "Adopt this typical error"}
      </button>
      {adopted && !adopt.isPending && (
        <p role="status" className="mt-2 text-sm">
          Adopted: {test.name} now has a typical error of{" "}
          {adopted.typicalError === null ? "–" : plain(adopted.typicalError, d)} {test.unit} on {adopted.typicalErrorDf}{" "}
          df ({adopted.typicalErrorSource}); test version {adopted.version}.
        </p>
      )}
      {adopt.error && (
        <p role="alert" className="mt-2 text-sm font-semibold">
          Not adopted: {adopt.error.message}
        </p>
      )}
    </section>
  );
}
