"use client";

import { useId } from "react";
import { defaultDraft, type MappingDraft, withAthleteColumn } from "@/lib/import/mapping-draft";
import type { ImportPreview } from "@/lib/import/summary";
import type { WideColumnStatus } from "@/lib/import/types";

const STATUS_WORDS: Record<WideColumnStatus, { text: string; className: string }> = {
  athlete: { text: "athlete", className: "bg-ink text-white" },
  matched: { text: "test found", className: "bg-gain-soft text-ink" },
  ignored: { text: "not a test", className: "bg-steady-soft text-ink" },
  unknown: { text: "no such test", className: "bg-decline-soft text-ink" },
  "not-in-battery": { text: "not in this battery", className: "bg-decline-soft text-ink" },
};

function ColumnSelect({
  label,
  value,
  headers,
  onChange,
  optional,
}: {
  label: string;
  value: string;
  headers: string[];
  onChange: (v: string) => void;
  optional?: string;
}) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <select id={id} className="field" value={value} onChange={(e) => onChange(e.target.value)}>
        {optional !== undefined ? (
          <option value="">{optional}</option>
        ) : (
          <option value="" disabled>
            Choose a column
          </option>
        )}
        {headers
          .filter((h) => h !== "")
          .map((h) => (
            <option key={h} value={h}>
              {h}
            </option>
          ))}
      </select>
    </div>
  );
}

/** How the file's columns are read: long (one row per trial) or wide (one column per test-trial). */
export function MappingStep({
  preview,
  draft,
  onChange,
}: {
  preview: ImportPreview;
  draft: MappingDraft;
  onChange: (draft: MappingDraft) => void;
}) {
  const formatId = useId();
  const testsById = new Map(preview.tests.map((t) => [t.id, t]));
  const suggestion = new Map(preview.suggestions.map((s) => [s.header, s.status]));

  return (
    <section aria-labelledby={`${formatId}-h`} className="card space-y-4 p-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id={`${formatId}-h`} className="text-lg font-bold">
            Mapping
          </h2>
          <p className="text-sm text-ink-soft">How the columns are read. Change a choice, then check the file again.</p>
        </div>
        <div className="w-72">
          <label htmlFor={formatId} className="label">
            Layout of the file
          </label>
          <select
            id={formatId}
            className="field"
            value={draft.format}
            onChange={(e) => onChange(defaultDraft(preview, e.target.value as "long" | "wide"))}
          >
            <option value="long">Long: one row per trial</option>
            <option value="wide">Wide: one column per test-trial</option>
          </select>
        </div>
      </div>

      {draft.format === "long" ? (
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <ColumnSelect
            label="Athlete (name or external id)"
            value={draft.athlete}
            headers={preview.headers}
            onChange={(v) => onChange({ ...draft, athlete: v })}
          />
          <ColumnSelect
            label="Test (name)"
            value={draft.test}
            headers={preview.headers}
            onChange={(v) => onChange({ ...draft, test: v })}
          />
          <ColumnSelect
            label="Trial (1, 2, 3…)"
            value={draft.trial}
            headers={preview.headers}
            optional="No trial column: all trial 1"
            onChange={(v) => onChange({ ...draft, trial: v })}
          />
          <ColumnSelect
            label="Score"
            value={draft.value}
            headers={preview.headers}
            onChange={(v) => onChange({ ...draft, value: v })}
          />
        </div>
      ) : (
        <>
          <div className="max-w-sm">
            <ColumnSelect
              label="Athlete column (name or external id)"
              value={draft.athleteColumn}
              headers={preview.headers}
              onChange={(v) => onChange(withAthleteColumn(draft, preview.headers, v))}
            />
          </div>
          <div className="relative overflow-x-auto">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">What each column of the file holds</caption>
              <thead className="border-b border-line text-xs uppercase tracking-wide text-ink-faint">
                <tr>
                  <th scope="col" className="px-2 py-2 font-semibold">
                    Column in the file
                  </th>
                  <th scope="col" className="px-2 py-2 font-semibold">
                    Read as
                  </th>
                  <th scope="col" className="px-2 py-2 font-semibold">
                    Test
                  </th>
                  <th scope="col" className="px-2 py-2 font-semibold">
                    Trial
                  </th>
                </tr>
              </thead>
              <tbody>
                {Object.entries(draft.columns).map(([header, chosen]) => {
                  const status = suggestion.get(header) ?? "unknown";
                  // A column nobody has chosen for yet is read as its header says, or reported: never ignored unasked.
                  const unread = chosen === "unread";
                  const target = unread ? null : chosen;
                  const words =
                    target && status !== "matched"
                      ? { text: "chosen here", className: STATUS_WORDS.matched.className }
                      : STATUS_WORDS[status];
                  const test = target ? testsById.get(target.testId) : undefined;
                  const set = (next: typeof chosen) =>
                    onChange({ ...draft, columns: { ...draft.columns, [header]: next } });
                  return (
                    <tr key={header} className="border-b border-line last:border-0">
                      <th scope="row" className="px-2 py-1.5 font-semibold">
                        {header}
                      </th>
                      <td className="px-2 py-1.5">
                        <span className={`rounded px-1.5 py-0.5 text-xs font-semibold ${words.className}`}>
                          {words.text}
                        </span>
                      </td>
                      <td className="px-2 py-1.5">
                        <select
                          aria-label={`Test for column ${header}`}
                          className="field py-1"
                          value={unread ? "unread" : target ? String(target.testId) : ""}
                          onChange={(e) =>
                            set(e.target.value ? { testId: Number(e.target.value), trial: target?.trial ?? 1 } : null)
                          }
                        >
                          {unread && (
                            <option value="unread" disabled>
                              Not read yet: choose a test
                            </option>
                          )}
                          <option value="">Ignore this column</option>
                          {preview.tests.map((t) => (
                            <option key={t.id} value={t.id}>
                              {t.name} ({t.unit})
                            </option>
                          ))}
                        </select>
                      </td>
                      <td className="px-2 py-1.5">
                        {test && target ? (
                          <select
                            aria-label={`Trial for column ${header}`}
                            className="field w-24 py-1"
                            value={target.trial}
                            onChange={(e) => set({ testId: target.testId, trial: Number(e.target.value) })}
                          >
                            {Array.from({ length: Math.max(test.trialsPerSession, target.trial) }, (_, i) => (
                              // biome-ignore lint/suspicious/noArrayIndexKey: the options are the trial numbers 1…n themselves
                              <option key={i + 1} value={i + 1}>
                                {i + 1}
                              </option>
                            ))}
                          </select>
                        ) : (
                          <span className="text-ink-faint">–</span>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </>
      )}
    </section>
  );
}
