"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { useCallback, useMemo } from "react";
import { type ResultRow, sessionQueries } from "@/lib/client/queries";
import { parseDecimal } from "@/lib/decimal";
import { MAX_TRIALS, type ResultFlag } from "@/lib/domain";
import { cellKey, padTrials, sameWanted, trialKey, type Wanted, wantedOf } from "@/lib/sheet/model";
import { type InvalidEntry, useInvalidEntries } from "./sheet/use-invalid-entries";
import { useResultSaver } from "./sheet/use-result-saver";
import { useSheetCache } from "./sheet/use-sheet-cache";
import { useSheetUndo } from "./sheet/use-sheet-undo";

export type { InvalidEntry } from "./sheet/use-invalid-entries";
export type { CellState } from "./sheet/use-result-saver";

type TrialEntry = { athleteId: number; testId: number; index: number; text: string };

/**
 * The Session sheet: its data (prefetched by the page), what each cell shows, and the entry
 * commands the grid calls. Saving, refused texts and undo live in the hooks under ./sheet.
 */
export function useSessionSheet(sessionId: number) {
  const query = useSuspenseQuery(sessionQueries.sheet(sessionId));
  const cache = useSheetCache(sessionId);
  const saver = useResultSaver(sessionId, query.data.writerId, cache);
  const entries = useInvalidEntries();
  const undo = useSheetUndo(sessionId, cache, saver.forget);
  const { cells } = saver;

  const results = useMemo(() => {
    const map = new Map<string, ResultRow>();
    for (const r of query.data.results) map.set(cellKey(r.athleteId, r.testId), r);
    return map;
  }, [query.data]);

  /** What the sheet shows for a result: the unsaved wish while saving/failed/conflicting, else the stored row. */
  const shownFor = useCallback(
    (athleteId: number, testId: number): Wanted => {
      const state = cells[cellKey(athleteId, testId)];
      if (state && state.status !== "saved") return state.wanted;
      return wantedOf(results.get(cellKey(athleteId, testId)));
    },
    [cells, results],
  );

  const slotsOf = (testId: number) => query.data.tests.find((t) => t.id === testId)?.trialsPerSession ?? 1;

  /**
   * Applies typed or pasted trial texts. Non-numbers are refused on their cell and never sent;
   * the rest are grouped per result so each result is written once.
   */
  function enterTrials(typed: TrialEntry[]) {
    const refused: Record<string, InvalidEntry> = {};
    const accepted: string[] = [];
    const changes = new Map<string, { athleteId: number; testId: number; wanted: Wanted }>();
    for (const e of typed) {
      const tk = trialKey(e.athleteId, e.testId, e.index);
      const parsed = parseDecimal(e.text);
      if (!parsed.ok) {
        refused[tk] = { text: e.text, message: `${parsed.message} Not saved.` };
        continue;
      }
      accepted.push(tk);
      const key = cellKey(e.athleteId, e.testId);
      const base = changes.get(key)?.wanted ?? shownFor(e.athleteId, e.testId);
      const trials = padTrials(base.trials, Math.max(slotsOf(e.testId), e.index + 1));
      trials[e.index] = parsed.value;
      changes.set(key, { athleteId: e.athleteId, testId: e.testId, wanted: { ...base, trials } });
    }
    entries.clear(accepted);
    entries.add(refused);
    for (const { athleteId, testId, wanted } of changes.values()) {
      if (!sameWanted(wanted, shownFor(athleteId, testId))) saver.send(athleteId, testId, wanted);
    }
    return { refused: Object.keys(refused).length };
  }

  function setFlag(athleteId: number, testId: number, flag: ResultFlag | null) {
    const base = shownFor(athleteId, testId);
    if (base.flag !== flag) saver.send(athleteId, testId, { ...base, flag });
  }

  /** Keep the server's value: drop ours. */
  function takeTheirs(athleteId: number, testId: number) {
    saver.forget(cellKey(athleteId, testId));
    entries.clear(Array.from({ length: MAX_TRIALS }, (_, i) => trialKey(athleteId, testId, i)));
  }

  return {
    data: query.data,
    sessionId,
    results,
    cells,
    invalid: entries.invalid,
    shownFor,
    enterTrials,
    setFlag,
    takeTheirs,
    retry: saver.retry,
    revertTrial: (athleteId: number, testId: number, index: number) =>
      entries.clear([trialKey(athleteId, testId, index)]),
    undo,
    busy: Object.values(cells).some((c) => c.status === "saving"),
    /** Results typed while offline, kept in this browser until they can be sent. */
    waiting: saver.waiting,
  };
}

export type SessionSheetState = ReturnType<typeof useSessionSheet>;
