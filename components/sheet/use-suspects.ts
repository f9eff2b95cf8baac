"use client";

import { useEffect, useMemo, useRef, useState } from "react";
import type { SheetData } from "@/lib/client/queries";
import { formatValue } from "@/lib/labels";
import { cellKey, type Wanted } from "@/lib/sheet/model";
import { type Suspect, suspectTrials, typoGuardIndex } from "@/lib/suspect";
import { suspectSentence } from "@/lib/words/suspect";

/**
 * The typo guard over the sheet as it is shown now (typed scores included before they are
 * saved): suspect trials by cell, their count, and a sentence for the live region about the
 * ones that appeared since the last change — so a screen reader hears it as the coach types.
 */
export function useSuspects(data: SheetData, shownFor: (athleteId: number, testId: number) => Wanted) {
  const contextOf = useMemo(() => typoGuardIndex(data.typoGuard), [data.typoGuard]);
  const suspects = new Map<string, Suspect[]>();
  for (const athlete of data.athletes)
    for (const test of data.tests) {
      const shown = shownFor(athlete.id, test.id);
      const ctx = shown.flag ? null : contextOf(athlete.id, test.id);
      const found = ctx ? suspectTrials(athlete.id, test.id, shown.trials, ctx) : [];
      if (found.length > 0) suspects.set(cellKey(athlete.id, test.id), found);
    }
  const all = [...suspects.values()].flat();
  const signature = all.map((s) => `${s.athleteId}:${s.testId}:${s.trial}:${s.value}`).join("|");

  const seen = useRef<Set<string> | null>(null);
  const [news, setNews] = useState("");
  // biome-ignore lint/correctness/useExhaustiveDependencies: the signature stands for the list it was made from
  useEffect(() => {
    const keys = new Set(signature ? signature.split("|") : []);
    // Scores already doubted when the sheet opened are counted, not read out one by one.
    if (seen.current === null) {
      seen.current = keys;
      return;
    }
    const fresh = all.filter((s) => !seen.current!.has(`${s.athleteId}:${s.testId}:${s.trial}:${s.value}`));
    seen.current = keys;
    if (fresh.length === 0) return;
    const name = (id: number) => data.athletes.find((a) => a.id === id)?.name ?? "";
    setNews(
      fresh
        .map((s) => {
          const test = data.tests.find((t) => t.id === s.testId)!;
          return `Double-check ${name(s.athleteId)}, ${test.name} trial ${s.trial}: ${formatValue(s.value, test.decimals)} ${test.unit} is ${suspectSentence(s.reasons, test)}.`;
        })
        .join(" "),
    );
  }, [signature]);

  return { suspects, count: all.length, news };
}
