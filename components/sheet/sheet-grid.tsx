"use client";

import { useMemo, useRef } from "react";
import { useOverflowsParent } from "@/hooks/use-overflows-parent";
import type { SessionSheetState } from "@/hooks/use-session-sheet";
import type { SheetData, SheetTest } from "@/lib/client/queries";
import { isBlock, parseBlock, sheetColumns } from "@/lib/sheet/columns";
import type { Suspect } from "@/lib/suspect";
import { SheetHead } from "./sheet-head";
import { SheetRow } from "./sheet-row";

/**
 * The grid: athletes down, tests across. Keyboard first — Tab moves right (native order),
 * Enter moves down (back to the column where a run of Tabs began, as spreadsheets do),
 * Shift+Enter up, arrows move when the caret is at the edge, and a pasted block fills
 * cells from the focused one.
 */
export function SheetGrid({
  data,
  tests,
  sheet,
  canEdit,
  onAnnounce,
  suspects,
}: {
  data: SheetData;
  tests: SheetTest[];
  sheet: SessionSheetState;
  canEdit: boolean;
  onAnnounce: (message: string) => void;
  suspects: Map<string, Suspect[]>;
}) {
  const tableRef = useRef<HTMLTableElement>(null);
  const boxRef = useRef<HTMLDivElement>(null);
  const tooWide = useOverflowsParent(boxRef, tableRef);
  const anchor = useRef<number | null>(null);
  const { nav, trials, navIndex } = useMemo(() => sheetColumns(tests), [tests]);
  const totalColumns = 1 + tests.reduce((n, t) => n + t.trialsPerSession + 2, 0);

  function focusCell(row: number, col: number) {
    const el = tableRef.current?.querySelector<HTMLElement>(`[data-row="${row}"][data-col="${col}"]`);
    el?.focus();
    return Boolean(el);
  }

  function onKeyDown(event: React.KeyboardEvent<HTMLTableElement>) {
    const el = event.target as HTMLElement;
    if (el.dataset.col === undefined || event.altKey || event.ctrlKey || event.metaKey) return;
    const row = Number(el.dataset.row);
    const col = Number(el.dataset.col);
    const input = el instanceof HTMLInputElement ? el : null;
    const whole = input ? input.selectionStart === 0 && input.selectionEnd === input.value.length : true;
    switch (event.key) {
      case "Enter": {
        event.preventDefault();
        const target = event.shiftKey ? col : (anchor.current ?? col);
        anchor.current = null;
        if (!focusCell(event.shiftKey ? row - 1 : row + 1, target)) {
          // Last row: still commit what was typed.
          el.blur();
          el.focus();
        }
        return;
      }
      case "Tab":
        anchor.current = event.shiftKey ? null : (anchor.current ?? col);
        return;
      case "ArrowDown":
      case "ArrowUp":
        if (!input) return;
        event.preventDefault();
        anchor.current = null;
        focusCell(event.key === "ArrowDown" ? row + 1 : row - 1, col);
        return;
      case "ArrowLeft":
        if (input && !whole && (input.selectionStart !== 0 || input.selectionEnd !== 0)) return;
        event.preventDefault();
        anchor.current = null;
        focusCell(row, col - 1);
        return;
      case "ArrowRight":
        if (input && !whole && input.selectionStart !== input.value.length) return;
        event.preventDefault();
        anchor.current = null;
        focusCell(row, col + 1);
        return;
    }
  }

  function onPaste(event: React.ClipboardEvent<HTMLTableElement>) {
    const el = event.target as HTMLElement;
    if (!(el instanceof HTMLInputElement) || el.dataset.col === undefined) return;
    const text = event.clipboardData.getData("text/plain");
    if (!isBlock(text)) return; // one value: the input takes it as typed
    event.preventDefault();
    const start = nav[Number(el.dataset.col)];
    if (start?.kind !== "trial") return;
    const startRow = Number(el.dataset.row);
    const entries: Parameters<SessionSheetState["enterTrials"]>[0] = [];
    let outside = 0;
    parseBlock(text).forEach((cells, i) => {
      const athlete = data.athletes[startRow + i];
      cells.forEach((cell, j) => {
        const column = trials[start.trialCol + j];
        if (!athlete || !column) outside++;
        else entries.push({ athleteId: athlete.id, testId: column.test.id, index: column.index, text: cell });
      });
    });
    const { refused } = sheet.enterTrials(entries);
    // Cells refused as not numbers are counted beside this by the sheet itself, for as long as they stay.
    const parts = [`Pasted ${entries.length - refused} value${entries.length - refused === 1 ? "" : "s"}.`];
    if (outside > 0) parts.push(`${outside} fell outside the sheet and ${outside === 1 ? "was" : "were"} left out.`);
    onAnnounce(parts.join(" "));
  }

  return (
    // One scroll area, the page: the header sticks to the top of the window as the squad scrolls by.
    // A sheet wider than the screen scrolls in a box as tall as the window instead, so the header
    // and the names still stick ("Show" one test makes it fit again).
    <>
      <div
        ref={boxRef}
        className={`card relative w-fit max-w-full ${tooWide ? "max-h-[calc(100dvh-1rem)] overflow-auto" : ""}`}
      >
        <table
          ref={tableRef}
          className="w-max border-separate border-spacing-0 text-sm"
          onKeyDown={canEdit ? onKeyDown : undefined}
          onPaste={canEdit ? onPaste : undefined}
          onPointerDown={() => (anchor.current = null)}
        >
          <caption className="sr-only">
            Session sheet: one row per athlete; for each test its trials, the reduced score and a flag.
          </caption>
          <SheetHead tests={tests} />
          <tbody>
            {data.athletes.map((athlete, row) => (
              <SheetRow
                key={athlete.id}
                athlete={athlete}
                row={row}
                tests={tests}
                navIndex={navIndex}
                sheet={sheet}
                canEdit={canEdit}
                totalColumns={totalColumns}
                suspects={suspects}
              />
            ))}
            {data.athletes.length === 0 && (
              <tr>
                <td colSpan={totalColumns} className="px-4 py-6 text-center text-ink-soft">
                  This squad has no athletes yet. Add them on the Roster first.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      {/* Below the sheet, so the grid never moves under a finger when this appears after loading. */}
      {tooWide && (
        <p className="text-sm text-ink-soft">
          These tests are wider than the screen: the sheet scrolls sideways, or Show (above it) picks one test.
        </p>
      )}
    </>
  );
}
