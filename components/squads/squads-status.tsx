"use client";

import { type QueryState, QueryStatus } from "@/components/query-status";
import { isCoach } from "@/lib/auth/permissions";
import type { Role } from "@/lib/domain";

/** Loading, failure and empty state of the caller's squads (the Squads overview and the Roster list). */
export function SquadsStatus({ query, role }: { query: QueryState & { data?: unknown[] }; role: Role }) {
  const none = isCoach({ role })
    ? "You are not assigned to a squad yet. Ask your head of performance to add you."
    : "No squads yet.";
  return (
    <QueryStatus
      query={query}
      loading="Loading squads…"
      failure="Squads could not load"
      empty={query.data?.length === 0 && none}
    />
  );
}
