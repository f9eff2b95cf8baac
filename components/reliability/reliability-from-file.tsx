"use client";

import { useSuspenseQuery } from "@tanstack/react-query";
import { type FormEvent, useId, useState } from "react";
import { useReliabilityFromFile } from "@/hooks/use-writes";
import { ApiClientError } from "@/lib/client/fetch-json";
import { testQueries } from "@/lib/client/queries";
import type { RowError } from "@/lib/errors";
import { MAX_TWO_TRIAL_CHARS, RELIABILITY_CONFIDENCES } from "@/lib/validation/reports";
import { AdoptTypicalError } from "./adopt-typical-error";
import { ReliabilityModes } from "./reliability-modes";
import { ReliabilityCautions, StudyFigures } from "./study-figures";

const EXAMPLE = "athlete,first trial,second trial\nAthlete A,38.2,37.6\nAthlete B,41.0,41.9\nAthlete C,35.4,35.1";

const rowsOf = (error: unknown): RowError[] =>
  error instanceof ApiClientError ? ((error.body as { error?: { rows?: RowError[] } })?.error?.rows ?? []) : [];

/**
 * The Reliability check of scores collected outside Changewise (a pilot study, a colleague's
 * retest): paste or open a file of two trials per athlete. The scores are sent to be computed and
 * are not stored unless the typical error is adopted.
 */
export function ReliabilityFromFile({ canAdopt }: { canAdopt: boolean }) {
  const { data: tests } = useSuspenseQuery(testQueries.list());
  const check = useReliabilityFromFile();
  const ids = { test: useId(), confidence: useId(), text: useId(), file: useId(), help: useId() };
  const [testId, setTestId] = useState(tests[0]?.id ?? 0);
  const [confidence, setConfidence] = useState(0.95);
  const [text, setText] = useState("");
  const [fileName, setFileName] = useState("");
  const [fileProblem, setFileProblem] = useState<string | null>(null);
  const sent = check.variables;
  const report = check.data;

  async function open(file: File | undefined) {
    if (!file) return;
    if (file.size > MAX_TWO_TRIAL_CHARS * 4) {
      setFileProblem(`${file.name} is too large for a two-trial file. Open the file with one row per athlete.`);
      return;
    }
    setFileProblem(null);
    setFileName(file.name);
    setText(await file.text());
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    check.mutate({ testId, confidence, csv: text, fileName: fileName || "pasted scores" });
  }

  const rows = rowsOf(check.error);
  return (
    <section aria-labelledby="reliability-heading" className="space-y-4">
      <div>
        <h1 id="reliability-heading" className="text-2xl font-bold">
          Reliability check
        </h1>
        <p className="text-ink-soft">
          {report && sent ? (
            <>
              <span className="font-semibold text-ink">{report.test.name}</span> · {report.file.name} ·{" "}
              {report.file.rows} rows
            </>
          ) : (
            "Scores of the same athletes, tested twice a few days apart with no training between."
          )}
        </p>
      </div>
      <ReliabilityModes current="file" />
      {tests.length === 0 ? (
        <p className="card p-4">Add a test to the Test library first: the file&apos;s scores are read in its unit.</p>
      ) : (
        <form className="card space-y-3 p-4" onSubmit={submit} aria-describedby={ids.help}>
          <div className="grid gap-3 sm:grid-cols-2">
            <div>
              <label htmlFor={ids.test} className="text-sm font-semibold">
                Test the scores are from
              </label>
              <select
                id={ids.test}
                className="field mt-1"
                value={testId}
                onChange={(e) => setTestId(Number(e.target.value))}
              >
                {tests.map((t) => (
                  <option key={t.id} value={t.id}>
                    {t.name} ({t.unit})
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor={ids.confidence} className="text-sm font-semibold">
                Confidence
              </label>
              <select
                id={ids.confidence}
                className="field mt-1"
                value={confidence}
                onChange={(e) => setConfidence(Number(e.target.value))}
              >
                {RELIABILITY_CONFIDENCES.map((c) => (
                  <option key={c} value={c}>
                    {Math.round(c * 100)} %
                  </option>
                ))}
              </select>
            </div>
          </div>
          <div id={ids.help} className="text-sm text-ink-soft">
            <p>
              One row per athlete: a name or code, the first trial and the second trial — or just the two trials. A
              header row is optional. Separate columns with a comma, a semicolon or a tab (cells pasted from a
              spreadsheet are tab-separated); in a semicolon or tab file a decimal comma is read as a decimal point.
            </p>
          </div>
          <div className="flex flex-wrap items-center gap-3">
            <label htmlFor={ids.file} className="btn-quiet cursor-pointer">
              Open a CSV file
            </label>
            <input
              id={ids.file}
              type="file"
              accept=".csv,.txt,.tsv,text/csv,text/plain"
              className="sr-only"
              onChange={(e) => {
                void open(e.target.files?.[0]);
                e.target.value = "";
              }}
            />
            <span className="text-sm text-ink-soft">
              {fileName ? (
                <>
                  Opened <span className="font-semibold text-ink">{fileName}</span>; you can correct it below.
                </>
              ) : (
                "or paste the rows below"
              )}
            </span>
          </div>
          {fileProblem && (
            <p role="alert" className="text-sm font-semibold text-decline">
              {fileProblem}
            </p>
          )}
          <div>
            <label htmlFor={ids.text} className="text-sm font-semibold">
              Scores
            </label>
            <textarea
              id={ids.text}
              className="field num mt-1 h-48 font-mono text-sm placeholder:text-ink-faint"
              value={text}
              placeholder={EXAMPLE}
              spellCheck={false}
              onChange={(e) => {
                setText(e.target.value);
                if (!fileName) return;
                // Edited text is no longer the file as opened; the adopted source should not claim it is.
                setFileName(`${fileName.replace(/ \(edited\)$/, "")} (edited)`);
              }}
            />
          </div>
          <button type="submit" className="btn-primary" disabled={check.isPending || text.trim() === ""}>
            {check.isPending ? "Checking…" : "Check these scores"}
          </button>
        </form>
      )}
      {check.error && (
        <section role="alert" aria-labelledby="file-problem" className="card border-decline p-4">
          <h2 id="file-problem" className="text-lg font-bold">
            These scores cannot be checked
          </h2>
          <p className="text-sm">{check.error.message}</p>
          {rows.length > 0 && (
            <ul className="mt-2 list-disc pl-5 text-sm">
              {rows.map((r) => (
                <li key={`${r.row}-${r.column ?? ""}`}>
                  Row {r.row}
                  {r.column && `, ${r.column}`}: {r.message}
                </li>
              ))}
            </ul>
          )}
          <p className="mt-2 text-xs text-ink-soft">Row numbers are as a spreadsheet shows them.</p>
        </section>
      )}
      {report && sent && !check.error && !check.isPending && (
        <>
          <StudyFigures report={report} plotKey={`${sent.testId}-${sent.confidence}-${sent.csv.length}`} />
          {canAdopt && <AdoptTypicalError report={report} source={{ fileName: sent.fileName, csv: sent.csv }} />}
        </>
      )}
      <ReliabilityCautions />
    </section>
  );
}
