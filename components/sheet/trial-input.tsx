"use client";

import { memo, useState } from "react";
import { paddedNumber } from "@/lib/decimal";

/**
 * One trial slot. Keeps what is typed locally and hands it over on blur; navigation keys
 * and paste are handled by the grid (through the data-* attributes).
 */
export const TrialInput = memo(function TrialInput({
  id,
  label,
  value,
  decimals,
  invalid,
  suspect,
  dimmed,
  row,
  col,
  onCommit,
  onRevert,
}: {
  id: string;
  label: string;
  value: number | null;
  decimals: number;
  invalid?: { text: string; message: string };
  /** Why the typo guard doubts this score, and the id of the note under the row that says so. */
  suspect: { why: string; noteId: string } | null;
  dimmed: boolean;
  row: number;
  col: number;
  onCommit: (text: string) => void;
  onRevert: () => void;
}) {
  const [draft, setDraft] = useState<string | null>(null);
  const stored = invalid?.text ?? paddedNumber(value, decimals);
  const shown = draft ?? stored;
  const messageId = `${id}-msg`;

  const tone = invalid
    ? "border-decline bg-decline-soft ring-1 ring-decline"
    : suspect
      ? "border-decline border-dashed ring-1 ring-decline/60"
      : "border-control";

  return (
    <span className="relative block">
      <input
        id={id}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        aria-label={label}
        aria-invalid={invalid ? true : undefined}
        aria-describedby={invalid ? messageId : suspect?.noteId}
        title={invalid ? invalid.message : suspect ? `Check: ${suspect.why}` : undefined}
        data-row={row}
        data-col={col}
        value={shown}
        onFocus={(e) => {
          setDraft(stored);
          e.currentTarget.select();
        }}
        // A click (on this cell or on one that already has focus) selects the score, as Tab and
        // the arrows do; otherwise the caret lands inside it and new digits merge ("11.767.60").
        onMouseUp={(e) => {
          e.preventDefault();
          e.currentTarget.select();
        }}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={() => {
          const text = draft;
          setDraft(null);
          if (text !== null && text.trim() !== stored.trim()) onCommit(text);
        }}
        onKeyDown={(e) => {
          if (e.key === "Escape") {
            setDraft(paddedNumber(value, decimals));
            onRevert();
          }
        }}
        className={`num h-10 w-[3.5rem] rounded border px-1 text-right xl:w-[4.25rem] xl:px-1.5 text-base focus:border-gain focus:outline-none focus:ring-2 focus:ring-gain ${tone} ${
          dimmed ? "text-ink-faint" : "text-ink"
        }`}
      />
      {invalid && (
        <span
          id={messageId}
          role="alert"
          className="pointer-events-none absolute bottom-full left-0 z-30 mb-1 whitespace-nowrap rounded bg-ink px-2 py-1 text-xs font-semibold text-white shadow"
        >
          {invalid.message}
        </span>
      )}
    </span>
  );
});
