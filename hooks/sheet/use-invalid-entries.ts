"use client";

import { useCallback, useState } from "react";

export type InvalidEntry = { text: string; message: string };

/**
 * Texts typed into a trial that are not numbers: kept on their cell (never sent) so the person
 * sees what they typed and why it was refused, until they fix or revert it.
 */
export function useInvalidEntries() {
  const [invalid, setInvalid] = useState<Record<string, InvalidEntry>>({});

  const clear = useCallback((keys: string[]) => {
    setInvalid((prev) => {
      if (!keys.some((k) => k in prev)) return prev;
      const next = { ...prev };
      for (const k of keys) delete next[k];
      return next;
    });
  }, []);

  const add = useCallback((entries: Record<string, InvalidEntry>) => {
    if (Object.keys(entries).length > 0) setInvalid((prev) => ({ ...prev, ...entries }));
  }, []);

  return { invalid, clear, add };
}
