"use client";

import type { SheetTest } from "@/lib/client/queries";
import { formatValue } from "@/lib/labels";
import type { Suspect } from "@/lib/suspect";
import { suspectSentence } from "@/lib/words/suspect";

/** The id of the note that explains a suspect trial; its input points at it (aria-describedby). */
export const suspectNoteId = (athleteId: number, testId: number, trial: number) =>
  `why-${athleteId}-${testId}-${trial}`;

/** Under an athlete's row: each score the typo guard doubts, and why. Saved all the same. */
export function SuspectNotes({ suspects, tests }: { suspects: Suspect[]; tests: SheetTest[] }) {
  return (
    <ul className="space-y-1">
      {suspects.map((s) => {
        const test = tests.find((t) => t.id === s.testId);
        if (!test) return null;
        return (
          <li
            key={`${s.testId}-${s.trial}`}
            id={suspectNoteId(s.athleteId, s.testId, s.trial)}
            className="w-fit rounded-md border border-dashed border-decline bg-white px-3 py-1 text-sm"
          >
            <span aria-hidden className="mr-1 font-bold text-decline">
              ?
            </span>
            <strong>
              Double-check {test.name}
              {test.trialsPerSession > 1 ? `, trial ${s.trial}` : ""}: {formatValue(s.value, test.decimals)} {test.unit}
            </strong>{" "}
            — {suspectSentence(s.reasons, test)}. Saved; correct it if it is a typo.
          </li>
        );
      })}
    </ul>
  );
}
