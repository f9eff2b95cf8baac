"use client";

import { useId } from "react";
import type { ImportPreview } from "@/lib/import/summary";
import type { ImportMatches } from "@/lib/import/types";

type Kind = "athletes" | "tests";
type Unknown = {
  value: string;
  rows: number[];
  count: number;
  ambiguous: boolean;
  suggestions: { id: number; name: string }[];
};

const rowsText = (rows: number[], count: number, column: boolean) =>
  column
    ? `${count} ${count === 1 ? "column" : "columns"}`
    : `${rows.length === 1 ? "row" : "rows"} ${rows.join(", ")}${count > rows.length ? ` and ${count - rows.length} more` : ""}`;

/**
 * The mapping step for names: each athlete or test the file names and Changewise does not know,
 * with "Use …" for the close ones and a list of the rest; what has been matched, with Undo; and
 * whether to remember the matches as other names for the next file.
 */
export function NameMatches({
  preview,
  matches,
  remember,
  busy,
  canRememberTests,
  onMatch,
  onLeave,
  onRemember,
}: {
  preview: ImportPreview;
  matches: ImportMatches;
  remember: boolean;
  busy: boolean;
  canRememberTests: boolean;
  onMatch: (kind: Kind, value: string, id: number | null) => void;
  onLeave: (kind: Kind, name: string, leave: boolean) => void;
  onRemember: (remember: boolean) => void;
}) {
  const athletes: Unknown[] = preview.unknownAthletes.map((a) => ({
    value: a.value,
    rows: a.rows,
    count: a.count,
    ambiguous: a.reason === "ambiguous",
    suggestions: a.suggestions ?? [],
  }));
  const tests: (Unknown & { column: boolean; inLibrary: boolean })[] = preview.unknownTests.map((t) => ({
    value: t.name,
    rows: t.rows,
    count: t.count,
    ambiguous: false,
    column: t.column !== undefined,
    inLibrary: t.reason === "not-in-battery",
    suggestions: t.suggestions ?? [],
  }));
  const made = (["athletes", "tests"] as const).flatMap((kind) =>
    Object.entries(matches[kind]).map(([value, id]) => ({
      kind,
      value,
      name: (kind === "athletes" ? preview.roster : preview.tests).find((x) => x.id === id)?.name ?? "?",
    })),
  );
  const leftOut = preview.leftOut;
  if (athletes.length === 0 && tests.length === 0 && made.length === 0 && leftOut.length === 0) return null;
  const moreAthletes = preview.unknownAthleteCount - athletes.length;

  return (
    <section aria-labelledby="names-h" className="card space-y-3 p-4">
      <div>
        <h2 id="names-h" className="text-lg font-bold">
          Names in the file
        </h2>
        <p className="text-sm text-ink-soft">Say who or what a name stands for here; the file itself stays as it is.</p>
      </div>
      {athletes.length > 0 && (
        <NameGroup title="Athletes not on the roster">
          {athletes.map((a) => (
            <UnknownName
              key={`a:${a.value}`}
              kind="athletes"
              item={a}
              detail={`${a.ambiguous ? "two athletes share this name · " : ""}${rowsText(a.rows, a.count, false)}`}
              options={preview.roster}
              optionLabel="Another athlete on the roster…"
              busy={busy}
              onMatch={onMatch}
              onLeave={onLeave}
            />
          ))}
          {moreAthletes > 0 && <li className="text-sm text-ink-soft">and {moreAthletes} more names</li>}
        </NameGroup>
      )}
      {tests.length > 0 && (
        <NameGroup title="Tests not in this session's battery">
          {tests.map((t) =>
            t.inLibrary ? (
              <li key={`t:${t.value}`} className="rounded-md border border-line bg-paper px-3 py-2 text-sm">
                <p>
                  <span className="font-semibold">{t.value}</span>{" "}
                  <span className="text-ink-soft">
                    is in the Test library but not in this battery · {rowsText(t.rows, t.count, t.column)}. Add it to
                    the session's battery on the Session sheet (Edit session), or leave its scores out of this import
                    {t.column ? " (ignore its columns in the mapping above)" : ""}.
                  </span>
                </p>
                {!t.column && (
                  <button
                    type="button"
                    className="btn-quiet mt-1 px-2 py-1 text-sm"
                    disabled={busy}
                    onClick={() => onLeave("tests", t.value, true)}
                  >
                    Leave out these rows
                  </button>
                )}
              </li>
            ) : (
              <UnknownName
                key={`t:${t.value}`}
                kind="tests"
                item={t}
                detail={`not in the Test library · ${rowsText(t.rows, t.count, t.column)}`}
                options={preview.tests}
                optionLabel="Another test of the battery…"
                busy={busy}
                onMatch={onMatch}
                onLeave={t.column ? undefined : onLeave}
              />
            ),
          )}
        </NameGroup>
      )}
      {leftOut.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold">Left out of this import</h3>
          <ul className="mt-1 space-y-1 text-sm">
            {leftOut.map((l) => (
              <li key={`${l.kind}:${l.name}`} className="flex flex-wrap items-center gap-x-2">
                <span>
                  <span className="font-semibold">{l.name}</span>: <span className="num">{l.rows}</span>{" "}
                  {l.rows === 1 ? "row" : "rows"} not imported
                </span>
                <button
                  type="button"
                  className="btn-quiet px-2 py-0.5 text-sm"
                  disabled={busy}
                  onClick={() => onLeave(l.kind === "athlete" ? "athletes" : "tests", l.name, false)}
                  aria-label={`Take back in: ${l.name}`}
                >
                  Take back in
                </button>
              </li>
            ))}
          </ul>
        </div>
      )}
      {made.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold">Matched for this file</h3>
          <ul className="mt-1 space-y-1 text-sm">
            {made.map((m) => (
              <li key={`${m.kind}:${m.value}`} className="flex flex-wrap items-center gap-x-2">
                <span>
                  <span className="font-semibold">{m.value}</span> reads as{" "}
                  <span className="font-semibold">{m.name}</span>
                </span>
                <button
                  type="button"
                  className="btn-quiet px-2 py-0.5 text-sm"
                  disabled={busy}
                  onClick={() => onMatch(m.kind, m.value, null)}
                  aria-label={`Undo: ${m.value} reads as ${m.name}`}
                >
                  Undo
                </button>
              </li>
            ))}
          </ul>
          <label className="mt-2 flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              className="mt-0.5 h-4 w-4 accent-ink"
              checked={remember}
              onChange={(e) => onRemember(e.target.checked)}
            />
            <span>
              Remember these as other names, so the next file that spells them so is read without asking
              {!canRememberTests && made.some((m) => m.kind === "tests") && (
                <span className="block text-ink-soft">
                  Other names of tests are kept by the owner or a sport scientist in the Test library; a test matched
                  here serves this file only.
                </span>
              )}
            </span>
          </label>
        </div>
      )}
    </section>
  );
}

function NameGroup({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div>
      <h3 className="text-sm font-semibold">{title}</h3>
      <ul className="mt-1 space-y-2">{children}</ul>
    </div>
  );
}

function UnknownName({
  kind,
  item,
  detail,
  options,
  optionLabel,
  busy,
  onMatch,
  onLeave,
}: {
  kind: Kind;
  item: Unknown;
  detail: string;
  options: { id: number; name: string }[];
  optionLabel: string;
  busy: boolean;
  onMatch: (kind: Kind, value: string, id: number | null) => void;
  onLeave?: (kind: Kind, name: string, leave: boolean) => void;
}) {
  const selectId = useId();
  return (
    <li className="rounded-md border border-line bg-paper px-3 py-2 text-sm">
      <p>
        <span className="font-semibold">{item.value}</span> <span className="text-ink-soft">{detail}</span>
      </p>
      <div className="mt-1 flex flex-wrap items-center gap-2">
        {item.suggestions.length > 0 && <span>Did you mean</span>}
        {item.suggestions.map((s) => (
          <button
            key={s.id}
            type="button"
            className="btn-quiet border-ink px-2 py-1 text-sm"
            disabled={busy}
            onClick={() => onMatch(kind, item.value, s.id)}
          >
            Use {s.name}
          </button>
        ))}
        <label htmlFor={selectId} className="sr-only">
          Read “{item.value}” as
        </label>
        <select
          id={selectId}
          className="field w-auto max-w-full py-1 text-sm"
          disabled={busy}
          value=""
          onChange={(e) => e.target.value && onMatch(kind, item.value, Number(e.target.value))}
        >
          <option value="">
            {item.suggestions.length > 0 ? optionLabel : `Choose ${optionLabel.replace(/^Another /, "the ")}`}
          </option>
          {options.map((o) => (
            <option key={o.id} value={o.id}>
              {o.name}
            </option>
          ))}
        </select>
        {onLeave && (
          <button
            type="button"
            className="btn-quiet px-2 py-1 text-sm"
            disabled={busy}
            onClick={() => onLeave(kind, item.value, true)}
          >
            Leave out these rows
          </button>
        )}
      </div>
    </li>
  );
}
