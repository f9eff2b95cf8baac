"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useCallback, useMemo, useRef, useState } from "react";
import { parseDecimal } from "@/lib/decimal";
import {
  cellKey, padTrials, sameWanted, trialKey, wantedOf, withRow, type Wanted,
} from "@/lib/sheet/model";
import { MAX_TRIALS, type ResultFlag } from "@/lib/domain";
import type { ResultConflict, ResultRow, SheetData } from "@/lib/client/api-types";
import { reduceTrials, trimTrials } from "@/lib/trials";
import { ApiClientError, fetchJson, useApi } from "./use-api";

export type CellState =
  | { status: "saving"; wanted: Wanted }
  | { status: "saved" }
  | { status: "failed"; wanted: Wanted; message: string }
  | { status: "conflict"; wanted: Wanted; current: ResultRow | null };

export type InvalidEntry = { text: string; message: string };

type SaveVars = { key: string; athleteId: number; testId: number; wanted: Wanted; version: number | null; note: string | null };
type SaveContext = { previous: ResultRow | undefined };

/** A write that was never stored has no version; provisional (optimistic) rows use negative ids. */
const versionOf = (row: ResultRow | undefined) => (row && row.id > 0 ? row.version : null);

/**
 * State and writes of the Session sheet. Each result (athlete × test) saves on its own with
 * the version it read; writes to the same result are queued so we never conflict with ourselves.
 */
export function useSessionSheet(sessionId: number) {
  const url = `/api/sessions/${sessionId}`;
  const auditUrl = `${url}/audit`;
  const client = useQueryClient();
  const query = useApi<SheetData>(url);
  const [cells, setCells] = useState<Record<string, CellState>>({});
  // The same map for `send`, which also runs from mutation callbacks outside render.
  const cellsRef = useRef(cells);
  const [invalid, setInvalid] = useState<Record<string, InvalidEntry>>({});
  const inFlight = useRef(new Set<string>());
  const queued = useRef(new Map<string, Wanted>());

  const setCell = useCallback((key: string, state: CellState | null) => {
    const next = { ...cellsRef.current };
    if (state) next[key] = state;
    else delete next[key];
    cellsRef.current = next;
    setCells(next);
  }, []);

  const readRow = useCallback(
    (athleteId: number, testId: number) =>
      client.getQueryData<SheetData>([url])?.results.find((r) => r.athleteId === athleteId && r.testId === testId),
    [client, url],
  );
  const writeRow = useCallback(
    (athleteId: number, testId: number, row: ResultRow | null) =>
      client.setQueryData<SheetData>([url], (data) => (data ? withRow(data, athleteId, testId, row) : data)),
    [client, url],
  );

  const refreshAudit = useCallback(() => {
    if (inFlight.current.size === 0) void client.invalidateQueries({ queryKey: [auditUrl] });
  }, [client, auditUrl]);

  const mutation = useMutation<{ results: ResultRow[] }, Error, SaveVars, SaveContext>({
    mutationFn: (v) =>
      fetchJson(`${url}/results`, {
        method: "PUT",
        body: JSON.stringify({
          results: [{ athleteId: v.athleteId, testId: v.testId, trials: v.wanted.trials, flag: v.wanted.flag, note: v.note, version: v.version }],
        }),
      }),
    onMutate: async (v) => {
      await client.cancelQueries({ queryKey: [url] });
      const previous = readRow(v.athleteId, v.testId);
      const test = client.getQueryData<SheetData>([url])?.tests.find((t) => t.id === v.testId);
      const value = test ? reduceTrials(v.wanted.trials, test.trialRule, test.direction) : null;
      writeRow(v.athleteId, v.testId, {
        id: previous?.id ?? -1,
        athleteId: v.athleteId,
        testId: v.testId,
        trials: v.wanted.trials,
        value: v.wanted.flag === "invalid" || v.wanted.flag === "absent" ? null : value,
        flag: v.wanted.flag,
        note: v.note,
        version: previous?.version ?? 0,
        updatedAt: Date.now(),
        updatedByName: previous?.updatedByName ?? null,
      });
      return { previous };
    },
    onSuccess: (data, v) => {
      const saved = data.results.find((r) => r.athleteId === v.athleteId && r.testId === v.testId);
      if (saved) writeRow(v.athleteId, v.testId, saved);
      if (!queued.current.has(v.key)) setCell(v.key, { status: "saved" });
    },
    onError: (error, v, context) => {
      const wanted = queued.current.get(v.key) ?? v.wanted;
      queued.current.delete(v.key);
      if (error instanceof ApiClientError && error.status === 409) {
        const details = (error.body as { error?: { details?: { conflicts?: ResultConflict[] } } } | null)?.error?.details;
        const hit = details?.conflicts?.find((c) => c.athleteId === v.athleteId && c.testId === v.testId);
        if (hit) {
          // The sheet now holds their version; ours waits in the cell until the person chooses.
          writeRow(v.athleteId, v.testId, hit.current);
          setCell(v.key, { status: "conflict", wanted, current: hit.current });
          return;
        }
        writeRow(v.athleteId, v.testId, context?.previous ?? null);
        setCell(v.key, { status: "failed", wanted, message: `${error.message} Reload the sheet to see the latest scores.` });
        return;
      }
      writeRow(v.athleteId, v.testId, context?.previous ?? null);
      const message = error instanceof ApiClientError ? error.message : "No connection to the server.";
      setCell(v.key, { status: "failed", wanted, message });
    },
    onSettled: (_data, error, v) => {
      inFlight.current.delete(v.key);
      const next = queued.current.get(v.key);
      if (next && !error) {
        queued.current.delete(v.key);
        send(v.athleteId, v.testId, next);
      }
      refreshAudit();
    },
  });

  // `send` is used inside the mutation callbacks above, which run after render; a function
  // declaration keeps the two mutually reachable.
  function send(athleteId: number, testId: number, wanted: Wanted, { overwrite = false } = {}) {
    const key = cellKey(athleteId, testId);
    const clean = { trials: trimTrials(wanted.trials), flag: wanted.flag };
    const held = cellsRef.current[key];
    if (held?.status === "conflict" && !overwrite) {
      // Someone else's value is waiting for a decision: keep typing into ours, send nothing yet.
      setCell(key, { ...held, wanted: clean });
      return;
    }
    if (inFlight.current.has(key)) {
      queued.current.set(key, clean);
      setCell(key, { status: "saving", wanted: clean });
      return;
    }
    const row = readRow(athleteId, testId);
    inFlight.current.add(key);
    setCell(key, { status: "saving", wanted: clean });
    mutation.mutate({ key, athleteId, testId, wanted: clean, version: versionOf(row), note: row?.note ?? null });
  }

  const results = useMemo(() => {
    const map = new Map<string, ResultRow>();
    for (const r of query.data?.results ?? []) map.set(cellKey(r.athleteId, r.testId), r);
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

  const slotsOf = useCallback(
    (testId: number) => query.data?.tests.find((t) => t.id === testId)?.trialsPerSession ?? 1,
    [query.data],
  );

  const clearInvalid = useCallback((keys: string[]) => {
    setInvalid((prev) => {
      if (!keys.some((k) => k in prev)) return prev;
      const next = { ...prev };
      for (const k of keys) delete next[k];
      return next;
    });
  }, []);

  /**
   * Applies typed or pasted trial texts. Non-numbers are refused on their cell and never sent;
   * the rest are grouped per result so each result is written once.
   */
  function enterTrials(entries: { athleteId: number; testId: number; index: number; text: string }[]) {
    const refused: Record<string, InvalidEntry> = {};
    const accepted: string[] = [];
    const changes = new Map<string, { athleteId: number; testId: number; wanted: Wanted }>();
    for (const e of entries) {
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
    clearInvalid(accepted);
    if (Object.keys(refused).length > 0) setInvalid((prev) => ({ ...prev, ...refused }));
    for (const { athleteId, testId, wanted } of changes.values()) {
      if (!sameWanted(wanted, shownFor(athleteId, testId))) send(athleteId, testId, wanted);
    }
    return { refused: Object.keys(refused).length };
  }

  function setFlag(athleteId: number, testId: number, flag: ResultFlag | null) {
    const base = shownFor(athleteId, testId);
    if (base.flag !== flag) send(athleteId, testId, { ...base, flag });
  }

  /** Keep the server's value: drop ours. */
  function takeTheirs(athleteId: number, testId: number) {
    setCell(cellKey(athleteId, testId), null);
    clearInvalid(Array.from({ length: MAX_TRIALS }, (_, i) => trialKey(athleteId, testId, i)));
  }

  /** Retry a failed write, or overwrite after a conflict: the version now comes from their row. */
  function retry(athleteId: number, testId: number) {
    const state = cells[cellKey(athleteId, testId)];
    if (state && state.status !== "saved") send(athleteId, testId, state.wanted, { overwrite: true });
  }

  const undo = useMutation<{ undone: { athleteId: number; testId: number; result: ResultRow | null } }, Error, void>({
    mutationFn: () => fetchJson(`${url}/undo`, { method: "POST" }),
    onSuccess: ({ undone }) => {
      writeRow(undone.athleteId, undone.testId, undone.result);
      setCell(cellKey(undone.athleteId, undone.testId), null);
    },
    onSettled: () => {
      void client.invalidateQueries({ queryKey: [url] });
      void client.invalidateQueries({ queryKey: [auditUrl] });
    },
  });

  return {
    query,
    auditUrl,
    results,
    cells,
    invalid,
    shownFor,
    enterTrials,
    setFlag,
    takeTheirs,
    retry,
    revertTrial: (athleteId: number, testId: number, index: number) => clearInvalid([trialKey(athleteId, testId, index)]),
    undo,
    busy: Object.values(cells).some((c) => c.status === "saving"),
  };
}

export type SessionSheetState = ReturnType<typeof useSessionSheet>;
