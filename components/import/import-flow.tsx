"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ApiClientError } from "@/lib/client/fetch-json";
import { queryKeys } from "@/lib/client/queries";
import { type UploadProgress, uploadImport } from "@/lib/client/upload";
import type { RowError } from "@/lib/errors";
import {
  draftFromPreview,
  fieldsOf,
  type MappingDraft,
  matchFields,
  withLeftOut,
  withTestMatch,
} from "@/lib/import/mapping-draft";
import { hasMatches, NO_MATCHES } from "@/lib/import/matches";
import type { ImportCommitted, ImportPreview, ReplacementRow } from "@/lib/import/summary";
import type { ImportMatches } from "@/lib/import/types";
import { FilePicker } from "./file-picker";
import { ImportDone, PreviewFacts } from "./import-summary";
import { MappingStep } from "./mapping-step";
import { NameMatches } from "./name-matches";
import { ParsedValues, PreviewTable } from "./preview-table";
import { ProblemList, ReplacementList, WarningList } from "./problem-list";
import { ProgressBar } from "./progress-bar";

type ErrorBody = { error?: { rows?: RowError[]; details?: { replacements?: ReplacementRow[]; errorCount?: number } } };

const bodyOf = (error: unknown): ErrorBody | null =>
  error instanceof ApiClientError ? (error.body as ErrorBody | null) : null;

/** The Import screen: choose a file → preview and mapping → import, all or nothing. */
export function ImportFlow({ sessionId, canRememberTests }: { sessionId: number; canRememberTests: boolean }) {
  const client = useQueryClient();
  const [file, setFile] = useState<File | null>(null);
  const [draft, setDraft] = useState<MappingDraft | null>(null);
  const [sentFields, setSentFields] = useState<Record<string, string>>({});
  const [dirty, setDirty] = useState(false);
  const [replace, setReplace] = useState(false);
  const [matches, setMatches] = useState<ImportMatches>(NO_MATCHES);
  const [remember, setRemember] = useState(true);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [result, setResult] = useState<ImportCommitted | null>(null);

  const preview = useMutation({
    mutationFn: (vars: { file: File; fields: Record<string, string> }) =>
      uploadImport<ImportPreview>(sessionId, "preview", vars.file, vars.fields, setProgress),
    onMutate: () => setProgress(null),
    onSuccess: (answer, vars) => {
      setDraft(draftFromPreview(answer));
      setSentFields(vars.fields);
      setDirty(false);
      setReplace(false);
      commit.reset();
    },
  });
  const commit = useMutation({
    mutationFn: (vars: { file: File; fields: Record<string, string> }) =>
      uploadImport<ImportCommitted>(sessionId, "commit", vars.file, vars.fields, setProgress),
    onMutate: () => setProgress(null),
    onSuccess: (answer) => {
      setResult(answer);
      // Imported scores show on the sheet, in Recent changes and in the sessions' result counts.
      void client.invalidateQueries({ queryKey: queryKeys.sessions });
    },
  });

  const choose = (next: File) => {
    setFile(next);
    setResult(null);
    setDraft(null);
    setMatches(NO_MATCHES);
    setRemember(true);
    commit.reset();
    preview.mutate({ file: next, fields: {} });
  };
  // A match is checked at once: one click, and the preview shows what the name now reads as.
  const match = (kind: "athletes" | "tests", value: string, id: number | null) => {
    if (!draft) return;
    const next = { ...matches, [kind]: { ...matches[kind] } };
    if (id === null) delete next[kind][value];
    else next[kind][value] = id;
    recheck(next, kind === "tests" && preview.data ? withTestMatch(draft, preview.data.headers, value, id) : draft);
  };
  // Leaving a name's rows out (or taking them back in) is checked at once too.
  const leave = (kind: "athletes" | "tests", name: string, out: boolean) =>
    recheck(withLeftOut(matches, kind, name, out), draft);
  function recheck(next: ImportMatches, columns: MappingDraft | null) {
    if (!file || !columns) return;
    setMatches(next);
    // A mapping the server suggested stays its suggestion (a match then reads every column of that
    // name); one the user chose is sent again, with a matched test's columns pointed at it.
    const userMapping = dirty || Object.keys(sentFields).some((field) => field !== "matches");
    preview.mutate({ file, fields: { ...(userMapping ? fieldsOf(columns) : {}), ...matchFields(next) } });
  }
  const startOver = () => {
    setFile(null);
    setResult(null);
    setDraft(null);
    setMatches(NO_MATCHES);
    preview.reset();
    commit.reset();
  };

  if (result) return <ImportDone result={result} sessionId={sessionId} onAnother={startOver} />;

  const data = preview.data;
  const busy = preview.isPending || commit.isPending;
  const commitBody = bodyOf(commit.error);
  const conflictRows =
    commit.error instanceof ApiClientError && commit.error.status === 409
      ? (commitBody?.error?.details?.replacements ?? [])
      : [];
  const commitProblems =
    commit.error instanceof ApiClientError && commit.error.status === 422 ? (commitBody?.error?.rows ?? []) : [];
  const replacements = data ? Math.max(data.counts.trialsReplaced, conflictRows.length) : 0;
  const toWrite = data ? data.counts.resultsCreated + data.counts.resultsUpdated : 0;
  const canCommit = !!data && data.canCommit && !dirty && !busy && toWrite > 0 && (replacements === 0 || replace);

  return (
    <div className="space-y-4">
      <FilePicker onFile={choose} disabled={busy} current={file} />

      {busy && <ProgressBar progress={progress} label={preview.isPending ? "Checking" : "Importing"} />}

      {preview.error && (
        <p role="alert" className="rounded-md border border-decline bg-decline-soft px-3 py-2 text-sm">
          <span className="font-semibold">This file cannot be read.</span> {preview.error.message}
        </p>
      )}

      {data && draft && (
        <>
          <PreviewFacts preview={data} />
          <MappingStep
            preview={data}
            draft={draft}
            onChange={(next) => {
              setDraft(next);
              setDirty(true);
            }}
          />
          {dirty && (
            <div className="flex flex-wrap items-center gap-3">
              <button
                type="button"
                className="btn-primary"
                disabled={busy || !file}
                onClick={() =>
                  file && preview.mutate({ file, fields: { ...fieldsOf(draft), ...matchFields(matches) } })
                }
              >
                Check the file with this mapping
              </button>
              <button
                type="button"
                className="btn-quiet"
                disabled={busy}
                onClick={() => {
                  setDraft(draftFromPreview(data));
                  setDirty(false);
                }}
              >
                Undo mapping changes
              </button>
            </div>
          )}
          <NameMatches
            preview={data}
            matches={matches}
            remember={remember}
            busy={busy}
            canRememberTests={canRememberTests}
            onMatch={match}
            onLeave={leave}
            onRemember={setRemember}
          />
          <ProblemList errors={data.errors} errorCount={data.errorCount} />
          {commitProblems.length > 0 && (
            <ProblemList
              title="The import was refused"
              errors={commitProblems}
              errorCount={commitBody?.error?.details?.errorCount ?? commitProblems.length}
            />
          )}
          <ReplacementList
            rows={conflictRows.length ? conflictRows : data.replacements}
            count={replacements}
            tests={data.tests}
          />
          <WarningList warnings={data.warnings} count={data.warningCount} />
          <PreviewTable preview={data} />
          <ParsedValues preview={data} />

          <section aria-label="Import" className="card flex flex-wrap items-center gap-4 p-4">
            {replacements > 0 && (
              <label className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="h-4 w-4 accent-ink"
                  checked={replace}
                  onChange={(e) => setReplace(e.target.checked)}
                />
                Replace the {replacements} stored {replacements === 1 ? "value" : "values"} listed above
              </label>
            )}
            <button
              type="button"
              className="btn-primary"
              disabled={!canCommit}
              onClick={() =>
                file &&
                commit.mutate({
                  file,
                  fields: {
                    ...sentFields,
                    ...(replace ? { replace: "yes" } : {}),
                    ...(remember && hasMatches(matches) ? { remember: "yes" } : {}),
                  },
                })
              }
            >
              Import {toWrite} {toWrite === 1 ? "result" : "results"}
            </button>
            <p className="text-sm text-ink-soft" aria-live="polite">
              {dirty
                ? "Check the file with the new mapping first."
                : data.errorCount > 0
                  ? "Fix the problems above: match the names, change the mapping, or correct the file and choose it again."
                  : toWrite === 0
                    ? "The session already holds every score in this file."
                    : replacements > 0 && !replace
                      ? "Tick the box to replace stored values, or fix the file."
                      : "All or nothing: if anything fails, nothing is written."}
            </p>
            {commit.error && conflictRows.length === 0 && commitProblems.length === 0 && (
              <p role="alert" className="w-full rounded-md border border-decline bg-decline-soft px-3 py-2 text-sm">
                {commit.error.message}
              </p>
            )}
          </section>
        </>
      )}
    </div>
  );
}
