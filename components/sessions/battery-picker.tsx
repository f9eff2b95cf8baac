"use client";

import type { ReactNode } from "react";
import type { SheetTest } from "@/lib/client/queries";
import { trialRuleWords } from "@/lib/labels";

type Choice = Pick<SheetTest, "id" | "name" | "unit" | "trialRule" | "trialsPerSession">;

/**
 * The battery of a session as checkboxes, kept in the order the tests are listed.
 * `locked` tests stay ticked and cannot be removed (they already have scores).
 */
export function BatteryPicker({
  tests,
  chosen,
  onChange,
  onBlur,
  locked = new Set<number>(),
  empty,
}: {
  tests: Choice[];
  chosen: number[];
  onChange: (ids: number[]) => void;
  onBlur?: () => void;
  locked?: Set<number>;
  empty?: ReactNode;
}) {
  return (
    <div className="grid gap-1 rounded-md border border-line p-3 sm:grid-cols-2">
      {tests.map((t) => (
        <label key={t.id} className="flex items-center gap-2 py-1 text-sm">
          <input
            type="checkbox"
            checked={chosen.includes(t.id)}
            disabled={locked.has(t.id)}
            onBlur={onBlur}
            onChange={(e) =>
              onChange(
                e.target.checked
                  ? tests.filter((x) => x.id === t.id || chosen.includes(x.id)).map((x) => x.id)
                  : chosen.filter((id) => id !== t.id),
              )
            }
          />
          <span className="font-semibold">{t.name}</span>
          <span className="text-ink-faint">
            {locked.has(t.id)
              ? "has scores"
              : `${t.unit} · ${trialRuleWords(t.trialRule, t.trialsPerSession).toLowerCase()}`}
          </span>
        </label>
      ))}
      {empty}
    </div>
  );
}
