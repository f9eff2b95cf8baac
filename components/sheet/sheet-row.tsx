"use client";

import Link from "next/link";
import { Fragment } from "react";
import type { SessionSheetState } from "@/hooks/use-session-sheet";
import type { SheetTest } from "@/lib/client/queries";
import { paddedNumber } from "@/lib/decimal";
import { RESULT_FLAGS, type ResultFlag } from "@/lib/domain";
import { FLAG_LABELS, formatValue } from "@/lib/labels";
import { cellKey, padTrials, trialKey } from "@/lib/sheet/model";
import type { Suspect } from "@/lib/suspect";
import { reduceTrials, trialSpread } from "@/lib/trials";
import { suspectSentence } from "@/lib/words/suspect";
import { CellIssues, type Issue } from "./cell-issues";
import { CellStatus } from "./cell-status";
import { SuspectNotes, suspectNoteId } from "./suspect-notes";
import { TrialInput } from "./trial-input";

type Athlete = { id: number; name: string; position: string | null };

/** One athlete: for each test its trial slots, the reduced score with its spread, and the flag. */
export function SheetRow({
  athlete,
  row,
  tests,
  navIndex,
  sheet,
  canEdit,
  totalColumns,
  suspects,
}: {
  athlete: Athlete;
  row: number;
  tests: SheetTest[];
  navIndex: Map<string, number>;
  sheet: SessionSheetState;
  canEdit: boolean;
  totalColumns: number;
  /** Suspect trials by cell key (lib/suspect.ts), as the sheet shows them now. */
  suspects: Map<string, Suspect[]>;
}) {
  const issues: Issue[] = [];
  const doubts = tests.flatMap((t) => suspects.get(cellKey(athlete.id, t.id)) ?? []);
  return (
    <>
      <tr className="group">
        <th
          scope="row"
          className="sticky left-0 z-10 max-w-36 border-b border-line bg-white px-3 py-1 text-left font-semibold group-hover:bg-paper xl:max-w-none"
        >
          <Link
            href={`/athletes/${athlete.id}`}
            className="block text-sm underline-offset-2 hover:underline xl:whitespace-nowrap"
            title={`Athlete history of ${athlete.name}`}
          >
            {athlete.name}
          </Link>
          {athlete.position && <span className="block text-xs font-normal text-ink-faint">{athlete.position}</span>}
        </th>
        {tests.map((test) => {
          const key = cellKey(athlete.id, test.id);
          const shown = sheet.shownFor(athlete.id, test.id);
          const state = sheet.cells[key];
          if (state && (state.status === "failed" || state.status === "conflict"))
            issues.push({ testId: test.id, testName: test.name, decimals: test.decimals, state });
          const trials = padTrials(shown.trials, test.trialsPerSession);
          const value = reduceTrials(trials, test.trialRule, test.direction);
          const spread = trialSpread(trials);
          const label = `${athlete.name}, ${test.name}`;
          const dimmed = shown.flag === "absent" || shown.flag === "invalid";
          return (
            <Fragment key={test.id}>
              {Array.from({ length: test.trialsPerSession }, (_, index) => {
                const v = trials[index] ?? null;
                const doubt = suspects.get(key)?.find((s) => s.trial === index + 1);
                const suspect = doubt
                  ? { why: suspectSentence(doubt.reasons, test), noteId: suspectNoteId(athlete.id, test.id, index + 1) }
                  : null;
                const trialLabel = `${label}, trial ${index + 1}`;
                return (
                  <td
                    // biome-ignore lint/suspicious/noArrayIndexKey: trial slots: the trial number is the identity
                    key={index}
                    className={`border-b border-line px-0.5 py-1 ${index === 0 ? "border-l-2 pl-2" : ""}`}
                  >
                    {canEdit ? (
                      <TrialInput
                        id={`cell-${athlete.id}-${test.id}-${index}`}
                        label={trialLabel}
                        value={v}
                        decimals={test.decimals}
                        invalid={sheet.invalid[trialKey(athlete.id, test.id, index)]}
                        suspect={suspect}
                        dimmed={dimmed}
                        row={row}
                        col={navIndex.get(`${test.id}:${index}`) ?? 0}
                        onCommit={(text) =>
                          sheet.enterTrials([{ athleteId: athlete.id, testId: test.id, index, text }])
                        }
                        onRevert={() => sheet.revertTrial(athlete.id, test.id, index)}
                      />
                    ) : (
                      <span
                        aria-describedby={suspect?.noteId}
                        className={`num block w-[3.5rem] rounded px-1 py-2 text-right xl:w-[4.25rem] xl:px-1.5 ${suspect ? "border border-dashed border-decline" : ""}`}
                      >
                        <span className="sr-only">{trialLabel}: </span>
                        {v === null ? "–" : paddedNumber(v, test.decimals)}
                      </span>
                    )}
                  </td>
                );
              })}
              <td className="whitespace-nowrap border-b border-line px-1 py-1 text-right xl:px-2">
                <span className="flex items-center justify-end gap-1.5">
                  <span className="flex flex-col items-end leading-tight">
                    <span className="num text-base font-semibold">
                      <span className="sr-only">{`${label}, ${test.trialRule === "best" ? "best" : "mean"}: `}</span>
                      {shown.flag && value === null ? (
                        <em className="text-sm font-normal text-ink-soft">{FLAG_LABELS[shown.flag]}</em>
                      ) : (
                        formatValue(value, test.decimals)
                      )}
                    </span>
                    {spread !== null && (
                      <span className="num text-[11px] text-ink-faint" title="Spread of the trials (highest − lowest)">
                        ↔ {formatValue(spread, test.decimals)}
                      </span>
                    )}
                  </span>
                  {canEdit && (
                    <CellStatus state={state} label={label} onRetry={() => sheet.retry(athlete.id, test.id)} />
                  )}
                </span>
              </td>
              <td className="border-b border-line px-1 py-1">
                {canEdit ? (
                  <select
                    aria-label={`${label}, flag`}
                    data-row={row}
                    data-col={navIndex.get(`${test.id}:flag`) ?? 0}
                    value={shown.flag ?? ""}
                    onChange={(e) => sheet.setFlag(athlete.id, test.id, (e.target.value || null) as ResultFlag | null)}
                    className={`h-10 w-16 rounded border border-control bg-white px-1 text-sm xl:w-[5.5rem] focus:border-gain focus:outline-none focus:ring-2 focus:ring-gain ${
                      shown.flag ? "font-semibold" : "text-ink-faint"
                    }`}
                  >
                    <option value="">—</option>
                    {RESULT_FLAGS.map((f) => (
                      <option key={f} value={f}>
                        {FLAG_LABELS[f]}
                      </option>
                    ))}
                  </select>
                ) : (
                  <span className="text-sm">{shown.flag ? FLAG_LABELS[shown.flag] : ""}</span>
                )}
              </td>
            </Fragment>
          );
        })}
      </tr>
      {doubts.length > 0 && (
        <tr>
          <td colSpan={totalColumns} className="border-b border-line bg-paper px-2 py-1.5">
            <NoteBox>
              <SuspectNotes suspects={doubts} tests={tests} />
            </NoteBox>
          </td>
        </tr>
      )}
      {issues.length > 0 && (
        <tr>
          <td colSpan={totalColumns} className="border-b border-line bg-paper px-2 py-1.5">
            <NoteBox>
              <CellIssues
                athleteName={athlete.name}
                issues={issues}
                onRetry={(testId) => sheet.retry(athlete.id, testId)}
                onTheirs={(testId) => sheet.takeTheirs(athlete.id, testId)}
              />
            </NoteBox>
          </td>
        </tr>
      )}
    </>
  );
}

/**
 * A note under a row: as wide as the sheet at most (its text never widens the table and pulls
 * the columns away from their headings), within the screen, and kept in view as the sheet
 * scrolls sideways.
 */
function NoteBox({ children }: { children: React.ReactNode }) {
  return (
    <div className="w-0 min-w-full">
      <div className="sticky left-2 w-fit max-w-[min(100%,calc(100vw-4rem))]">{children}</div>
    </div>
  );
}
