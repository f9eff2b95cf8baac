"use client";

import { useMutation } from "@tanstack/react-query";
import { undoRequest } from "@/lib/client/writes";
import { cellKey } from "@/lib/sheet/model";
import type { SheetCache } from "./use-sheet-cache";

/** Reverts the caller's last sheet change; the sheet and Recent changes reload either way. */
export function useSheetUndo(sessionId: number, cache: SheetCache, forgetCell: (key: string) => void) {
  return useMutation({
    mutationFn: () => undoRequest(sessionId),
    onSuccess: (undone) => {
      cache.writeRow(undone.athleteId, undone.testId, undone.result);
      forgetCell(cellKey(undone.athleteId, undone.testId));
    },
    onSettled: () => Promise.all([cache.refreshSheet(), cache.refreshAudit()]),
  });
}
