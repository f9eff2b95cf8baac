"use client";

import type { SheetData } from "@/lib/client/queries";
import type { Wanted } from "@/lib/sheet/model";

/** Which athletes still have no score (and no flag) for which test, folded under one line. */
export function MissingScores({
  data,
  shownFor,
}: {
  data: SheetData;
  shownFor: (athleteId: number, testId: number) => Wanted;
}) {
  const missing = data.athletes
    .map((a) => ({
      athlete: a,
      tests: data.tests.filter((t) => {
        const shown = shownFor(a.id, t.id);
        return shown.flag === null && !shown.trials.some((v) => v !== null);
      }),
    }))
    .filter((m) => m.tests.length > 0);
  const count = missing.reduce((n, m) => n + m.tests.length, 0);
  if (count === 0) return null;
  return (
    <details className="text-sm">
      <summary className="w-fit cursor-pointer font-semibold">
        {count} {count === 1 ? "score" : "scores"} missing ({missing.length}{" "}
        {missing.length === 1 ? "athlete" : "athletes"}) — give a score or a flag
      </summary>
      <ul className="mt-1 columns-1 gap-6 sm:columns-2 lg:columns-3">
        {missing.map(({ athlete, tests }) => (
          <li key={athlete.id} className="break-inside-avoid">
            <span className="font-semibold">{athlete.name}</span>:{" "}
            {tests.length === data.tests.length && data.tests.length > 1
              ? "every test"
              : tests.map((t) => t.name).join(", ")}
          </li>
        ))}
      </ul>
    </details>
  );
}
