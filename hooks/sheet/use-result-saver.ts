"use client";

import { useMutation } from "@tanstack/react-query";
import { useCallback, useEffect, useRef, useState } from "react";
import { ApiClientError } from "@/lib/client/fetch-json";
import { forgetWrite, keepWrite, waitingWrites } from "@/lib/client/offline-writes";
import type { ResultRow } from "@/lib/client/queries";
import { saveResultsRequest } from "@/lib/client/writes";
import { cellKey, type Wanted } from "@/lib/sheet/model";
import { reduceTrials, trimTrials } from "@/lib/trials";
import type { SheetCache } from "./use-sheet-cache";

export type CellState =
  | { status: "saving"; wanted: Wanted }
  /** Typed while the network was down: kept in the browser, sent when the connection returns. */
  | { status: "waiting"; wanted: Wanted }
  | { status: "saved" }
  | { status: "failed"; wanted: Wanted; message: string }
  | { status: "conflict"; wanted: Wanted; current: ResultRow | null };

type ResultConflict = { athleteId: number; testId: number; current: ResultRow | null };
type SaveVars = {
  key: string;
  athleteId: number;
  testId: number;
  wanted: Wanted;
  version: number | null;
  note: string | null;
};

/** A write that was never stored has no version; provisional (optimistic) rows use negative ids. */
const versionOf = (row: ResultRow | undefined) => (row && row.id > 0 ? row.version : null);

const conflictOf = (error: ApiClientError, athleteId: number, testId: number) =>
  (error.body as { error?: { details?: { conflicts?: ResultConflict[] } } } | null)?.error?.details?.conflicts?.find(
    (c) => c.athleteId === athleteId && c.testId === testId,
  );

const offline = () => typeof navigator !== "undefined" && !navigator.onLine;

/**
 * Saves each result (athlete × test) on its own with the version it read. Writes to the same
 * result are queued, so the sheet never conflicts with itself; a conflict with someone else
 * waits in its cell until the person chooses theirs or ours.
 */
export function useResultSaver(sessionId: number, userId: number, cache: SheetCache) {
  const [cells, setCells] = useState<Record<string, CellState>>({});
  // The same map for `send`, which also runs from mutation callbacks outside render.
  const cellsRef = useRef(cells);
  const inFlight = useRef(new Set<string>());
  const queued = useRef(new Map<string, Wanted>());

  const setCell = useCallback((key: string, state: CellState | null) => {
    const next = { ...cellsRef.current };
    if (state) next[key] = state;
    else delete next[key];
    cellsRef.current = next;
    setCells(next);
  }, []);

  const mutation = useMutation({
    mutationFn: (v: SaveVars) =>
      saveResultsRequest(sessionId, [
        {
          athleteId: v.athleteId,
          testId: v.testId,
          trials: v.wanted.trials,
          flag: v.wanted.flag,
          note: v.note,
          version: v.version,
        },
      ]),
    onMutate: async (v) => {
      await cache.cancelReads();
      const previous = cache.readRow(v.athleteId, v.testId);
      const test = cache.testOf(v.testId);
      const value = test ? reduceTrials(v.wanted.trials, test.trialRule, test.direction) : null;
      cache.writeRow(v.athleteId, v.testId, {
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
    onSuccess: (saved, v) => {
      const row = saved.find((r) => r.athleteId === v.athleteId && r.testId === v.testId);
      if (row) cache.writeRow(v.athleteId, v.testId, row);
      if (!queued.current.has(v.key)) setCell(v.key, { status: "saved" });
    },
    onError: (error, v, context) => {
      const wanted = queued.current.get(v.key) ?? v.wanted;
      queued.current.delete(v.key);
      const hit =
        error instanceof ApiClientError && error.status === 409 ? conflictOf(error, v.athleteId, v.testId) : undefined;
      if (hit) {
        // The sheet now holds their version; ours waits in the cell until the person chooses.
        cache.writeRow(v.athleteId, v.testId, hit.current);
        setCell(v.key, { status: "conflict", wanted, current: hit.current });
        return;
      }
      if (!(error instanceof ApiClientError)) {
        // No answer at all: the network is down. Keep the write and send it when it returns.
        hold(v.athleteId, v.testId, wanted, v.version, v.note);
        return;
      }
      cache.writeRow(v.athleteId, v.testId, context?.previous ?? null);
      const message =
        error instanceof ApiClientError
          ? error.status === 409
            ? `${error.message} Reload the sheet to see the latest scores.`
            : error.message
          : "No connection to the server.";
      setCell(v.key, { status: "failed", wanted, message });
    },
    onSettled: (_data, error, v) => {
      inFlight.current.delete(v.key);
      const next = queued.current.get(v.key);
      if (next && !error) {
        queued.current.delete(v.key);
        send(v.athleteId, v.testId, next);
      }
      if (inFlight.current.size === 0) void cache.refreshAudit();
    },
  });

  // Called from the mutation callbacks above, which run after render; a function
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
    if (offline() || held?.status === "waiting") {
      // Behind an earlier write still waiting in the browser: join it, so they go in order.
      const row = cache.readRow(athleteId, testId);
      hold(athleteId, testId, clean, versionOf(row), row?.note ?? null);
      if (!offline()) void replay();
      return;
    }
    if (inFlight.current.has(key)) {
      queued.current.set(key, clean);
      setCell(key, { status: "saving", wanted: clean });
      return;
    }
    const row = cache.readRow(athleteId, testId);
    inFlight.current.add(key);
    setCell(key, { status: "saving", wanted: clean });
    mutation.mutate({ key, athleteId, testId, wanted: clean, version: versionOf(row), note: row?.note ?? null });
  }

  /** Keeps a write in the browser until the network is back; the cell says it is waiting. */
  function hold(athleteId: number, testId: number, wanted: Wanted, version: number | null, note: string | null) {
    setCell(cellKey(athleteId, testId), { status: "waiting", wanted });
    void keepWrite({ sessionId, userId, athleteId, testId, ...wanted, note, version, typedAt: Date.now() }).catch(() =>
      setCell(cellKey(athleteId, testId), {
        status: "failed",
        wanted,
        message: "No connection, and this browser could not keep the score (storage is off or full).",
      }),
    );
  }

  const replaying = useRef(false);
  /** Sends the writes kept in the browser, oldest first, each with the version it was typed against. */
  async function replay() {
    if (replaying.current) return;
    replaying.current = true;
    try {
      for (const write of await waitingWrites(sessionId, userId)) {
        const key = cellKey(write.athleteId, write.testId);
        const wanted = { trials: write.trials, flag: write.flag };
        try {
          const saved = await saveResultsRequest(sessionId, [
            {
              athleteId: write.athleteId,
              testId: write.testId,
              trials: write.trials,
              flag: write.flag,
              note: write.note,
              version: write.version,
            },
          ]);
          const row = saved.find((r) => r.athleteId === write.athleteId && r.testId === write.testId);
          if (row) cache.writeRow(write.athleteId, write.testId, row);
          setCell(key, { status: "saved" });
        } catch (error) {
          // Still offline, or the server busy or failing: keep it, and try again at the next "online" or visit.
          if (!(error instanceof ApiClientError) || error.status >= 500 || error.status === 429) return;
          const hit = error.status === 409 ? conflictOf(error, write.athleteId, write.testId) : undefined;
          if (hit) {
            cache.writeRow(write.athleteId, write.testId, hit.current);
            setCell(key, { status: "conflict", wanted, current: hit.current });
          } else setCell(key, { status: "failed", wanted, message: error.message });
        }
        await forgetWrite(write.seq!);
      }
      void cache.refreshAudit();
    } finally {
      replaying.current = false;
    }
  }

  // Writes kept from an earlier visit show as waiting at once, and go as soon as there is a network.
  // biome-ignore lint/correctness/useExhaustiveDependencies: once per sheet; replay reads refs and the store
  useEffect(() => {
    let live = true;
    void waitingWrites(sessionId, userId)
      .then((writes) => {
        if (!live) return;
        for (const w of writes)
          setCell(cellKey(w.athleteId, w.testId), { status: "waiting", wanted: { trials: w.trials, flag: w.flag } });
        if (writes.length > 0 && !offline()) void replay();
      })
      .catch(() => undefined);
    const online = () => void replay();
    window.addEventListener("online", online);
    return () => {
      live = false;
      window.removeEventListener("online", online);
    };
  }, [sessionId]);

  /** Retry a failed write, or overwrite after a conflict: the version now comes from their row. */
  function retry(athleteId: number, testId: number) {
    const state = cellsRef.current[cellKey(athleteId, testId)];
    if (state && state.status !== "saved") send(athleteId, testId, state.wanted, { overwrite: true });
  }

  const waiting = Object.values(cells).filter((c) => c.status === "waiting").length;
  return { cells, send, retry, waiting, forget: (key: string) => setCell(key, null) };
}
