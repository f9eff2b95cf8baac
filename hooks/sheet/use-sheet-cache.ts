"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useCallback } from "react";
import { type ResultRow, sessionQueries } from "@/lib/client/queries";
import { withRow } from "@/lib/sheet/model";

/**
 * The Session sheet's rows as the query cache holds them: read one result, or put one in its
 * place (optimistically before the server answers, or the server's answer afterwards).
 */
export function useSheetCache(sessionId: number) {
  const client = useQueryClient();
  const { queryKey } = sessionQueries.sheet(sessionId);
  const auditKey = sessionQueries.audit(sessionId).queryKey;

  const sheet = useCallback(() => client.getQueryData(queryKey), [client, queryKey]);
  const readRow = useCallback(
    (athleteId: number, testId: number) =>
      sheet()?.results.find((r) => r.athleteId === athleteId && r.testId === testId),
    [sheet],
  );
  const writeRow = useCallback(
    (athleteId: number, testId: number, row: ResultRow | null) =>
      client.setQueryData(queryKey, (data) => (data ? withRow(data, athleteId, testId, row) : data)),
    [client, queryKey],
  );
  const testOf = useCallback((testId: number) => sheet()?.tests.find((t) => t.id === testId), [sheet]);
  const refreshSheet = useCallback(() => client.invalidateQueries({ queryKey }), [client, queryKey]);
  const refreshAudit = useCallback(() => client.invalidateQueries({ queryKey: auditKey }), [client, auditKey]);
  const cancelReads = useCallback(() => client.cancelQueries({ queryKey }), [client, queryKey]);

  return { readRow, writeRow, testOf, refreshSheet, refreshAudit, cancelReads };
}

export type SheetCache = ReturnType<typeof useSheetCache>;
