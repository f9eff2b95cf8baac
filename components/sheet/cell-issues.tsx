"use client";

import type { CellState } from "@/hooks/use-session-sheet";
import { describeEntry, timeWords } from "@/lib/sheet/model";

export type Issue = {
  testId: number;
  testName: string;
  decimals: number;
  state: Extract<CellState, { status: "failed" | "conflict" }>;
};

/**
 * Under an athlete's row: what did not save and why, with the way out. A conflict says who
 * changed the result and when, and lets the person keep theirs or overwrite with their own.
 */
export function CellIssues({
  athleteName,
  issues,
  onRetry,
  onTheirs,
}: {
  athleteName: string;
  issues: Issue[];
  onRetry: (testId: number) => void;
  onTheirs: (testId: number) => void;
}) {
  return (
    <ul className="space-y-1.5">
      {issues.map(({ testId, testName, decimals, state }) => (
        <li
          key={testId}
          role="alert"
          className="flex flex-wrap items-center gap-x-3 gap-y-1 rounded-md border border-decline bg-decline-soft px-3 py-1.5 text-sm"
        >
          {state.status === "conflict" ? (
            <span>
              <strong>
                {athleteName} · {testName}:
              </strong>{" "}
              {state.current
                ? `${state.current.updatedByName ?? "Someone else"} changed this at ${timeWords(state.current.updatedAt)} (now ${describeEntry(state.current, decimals)}).`
                : "Someone else removed this result."}{" "}
              Yours: {describeEntry(state.wanted, decimals)}.
            </span>
          ) : (
            <span>
              <strong>
                {athleteName} · {testName}:
              </strong>{" "}
              not saved. {state.message} Yours: {describeEntry(state.wanted, decimals)}.
            </span>
          )}
          <span className="flex gap-2">
            {state.status === "conflict" ? (
              <>
                <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => onTheirs(testId)}>
                  Use theirs
                </button>
                <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => onRetry(testId)}>
                  Overwrite with mine
                </button>
              </>
            ) : (
              <>
                <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => onRetry(testId)}>
                  Retry
                </button>
                <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => onTheirs(testId)}>
                  Discard mine
                </button>
              </>
            )}
          </span>
        </li>
      ))}
    </ul>
  );
}
