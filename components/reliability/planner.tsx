"use client";

import { useState } from "react";
import type { ReliabilityStudy } from "@/lib/client/queries";
import { PLANNER_POWERS } from "@/lib/reports/reliability-bands";
import { plain } from "@/lib/words/report";

const percent = (p: number) => `${Math.round(p * 100)} %`;

/**
 * The Planner: how many athletes a paired pre/post study needs to detect the SWC with this
 * test's noise, and how many trials per athlete bring the noise under the SWC.
 */
export function Planner({ report }: { report: ReliabilityStudy }) {
  const [power, setPower] = useState<number>(0.9);
  const { test, swc, athletesNeeded, trialsNeeded, planner } = report;
  const d = test.decimals + 1;
  const athletesAt = planner.find((p) => p.power === power)?.athletes ?? null;
  const count = (n: number | null) => (n === null ? "–" : `${n} athletes`);
  return (
    <section aria-labelledby="planner-heading" className="card p-4">
      <h2 id="planner-heading" className="text-lg font-bold">
        Planner
      </h2>
      <p className="text-sm text-ink-soft">
        A paired pre/post study of this test, two-sided at 5 %, to detect a true change of one SWC ({plain(swc, d)}{" "}
        {test.unit}); each athlete&apos;s change carries the error of two tests (√2 × typical error).
      </p>
      {swc > 0 && report.typicalError > 0 ? (
        <dl className="mt-2 grid gap-x-6 sm:grid-cols-3">
          <div className="border-t border-line py-2">
            <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Athletes at 80 % power</dt>
            <dd className="num text-base">{count(athletesNeeded)}</dd>
          </div>
          <div className="border-t border-line py-2">
            <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">
              <label htmlFor="planner-power">Athletes at power</label>
            </dt>
            <dd className="flex items-center gap-2">
              <select
                id="planner-power"
                className="field w-24"
                value={power}
                onChange={(e) => setPower(Number(e.target.value))}
              >
                {PLANNER_POWERS.map((p) => (
                  <option key={p} value={p}>
                    {percent(p)}
                  </option>
                ))}
              </select>
              <span className="num text-base" aria-live="polite">
                {count(athletesAt)}
              </span>
            </dd>
          </div>
          <div className="border-t border-line py-2">
            <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Trials per athlete</dt>
            <dd className="num text-base">{trialsNeeded === null ? "–" : trialsNeeded}</dd>
            <dd className="text-xs text-ink-soft">averaged per test day, so that the noise falls below the SWC</dd>
          </div>
        </dl>
      ) : (
        <p className="mt-2 text-sm">
          Planning needs a typical error and an SWC above zero; this study gives{" "}
          {report.typicalError > 0 ? "an SWC of zero" : "a typical error of zero"}.
        </p>
      )}
    </section>
  );
}
