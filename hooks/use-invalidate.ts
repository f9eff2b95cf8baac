"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useCallback } from "react";

/**
 * `useApi` keys queries by URL, so one list has several keys (with and without
 * `?archived=include`). This refreshes every query whose URL starts with one of the prefixes.
 */
export function useInvalidate() {
  const client = useQueryClient();
  return useCallback(
    (...prefixes: string[]) =>
      client.invalidateQueries({
        predicate: (query) => {
          const key = query.queryKey[0];
          return typeof key === "string" && prefixes.some((p) => key === p || key.startsWith(`${p}?`) || key.startsWith(`${p}/`));
        },
      }),
    [client],
  );
}
