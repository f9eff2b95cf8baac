"use client";

import Link from "next/link";
import type { ImportCommitted, ImportPreview } from "@/lib/import/summary";

const DELIMITERS: Record<string, string> = { ",": "comma ,", ";": "semicolon ;", "\t": "tab", "|": "bar |" };

/** One line on what the file is and what importing it would do. */
export function PreviewFacts({ preview }: { preview: ImportPreview }) {
  const c = preview.counts;
  return (
    <dl className="card grid gap-x-6 gap-y-2 p-4 text-sm sm:grid-cols-3 lg:grid-cols-6">
      <Fact term="File" value={preview.file.name} />
      <Fact
        term="Layout"
        value={`${preview.format === "long" ? "Long" : "Wide"}${preview.format !== preview.detectedFormat ? " (chosen)" : " (detected)"}`}
      />
      <Fact
        term="Delimiter"
        value={`${DELIMITERS[preview.delimiter] ?? preview.delimiter}${preview.decimalComma ? " · decimal comma" : ""}`}
      />
      <Fact term="Rows" value={String(preview.rowCount)} num />
      <Fact term="Scores in the file" value={String(c.values)} num />
      <Fact
        term="Results"
        value={`${c.resultsCreated} new · ${c.resultsUpdated} updated${c.resultsUnchanged ? ` · ${c.resultsUnchanged} already stored` : ""}`}
        num
      />
    </dl>
  );
}

function Fact({ term, value, num }: { term: string; value: string; num?: boolean }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs uppercase tracking-wide text-ink-faint">{term}</dt>
      <dd className={`break-words font-semibold ${num ? "num" : ""}`}>{value}</dd>
    </div>
  );
}

export function ImportDone({
  result,
  sessionId,
  onAnother,
}: {
  result: ImportCommitted;
  sessionId: number;
  onAnother: () => void;
}) {
  const c = result.counts;
  const written = c.resultsCreated + c.resultsUpdated;
  return (
    <section role="status" aria-labelledby="done-h" className="card border-gain p-6">
      <h2 id="done-h" className="text-xl font-bold">
        {written} {written === 1 ? "result" : "results"} stored
        {c.trialsReplaced > 0 && `, ${c.trialsReplaced} ${c.trialsReplaced === 1 ? "value" : "values"} replaced`}
      </h2>
      <p className="mt-1 text-ink-soft">
        From <span className="font-semibold text-ink">{result.filename}</span>: <span className="num">{c.values}</span>{" "}
        scores in <span className="num">{result.rowsImported}</span> {result.rowsImported === 1 ? "row" : "rows"} ·{" "}
        <span className="num">{c.resultsCreated}</span> new results, <span className="num">{c.resultsUpdated}</span>{" "}
        updated
        {c.trialsReplaced ? (
          <>
            , <span className="num">{c.trialsReplaced}</span> stored values replaced
          </>
        ) : null}
        {c.resultsUnchanged ? (
          <>
            , <span className="num">{c.resultsUnchanged}</span> already stored as they are
          </>
        ) : null}
        .
      </p>
      {result.suspects.length > 0 && (
        <p className="mt-2 w-fit rounded-md border border-dashed border-decline px-3 py-1 text-sm">
          <span className="font-semibold">
            {result.suspects.length} {result.suspects.length === 1 ? "score" : "scores"} to double-check
          </span>{" "}
          — stored as in the file; the Session sheet shows which and why.
        </p>
      )}
      {result.leftOut.length > 0 && (
        <p className="mt-2 text-sm">
          Left out as asked:{" "}
          {result.leftOut.map((l, i) => (
            <span key={`${l.kind}:${l.name}`}>
              {i > 0 && "; "}
              {l.name} (<span className="num">{l.rows}</span> {l.rows === 1 ? "row" : "rows"})
            </span>
          ))}
          .
        </p>
      )}
      {result.remembered.length > 0 && (
        <p className="mt-2 text-sm">
          Remembered for the next file:{" "}
          {result.remembered.map((r, i) => (
            <span key={`${r.kind}:${r.value}`}>
              {i > 0 && "; "}“{r.value}” is <span className="font-semibold">{r.name}</span>
            </span>
          ))}
          .
        </p>
      )}
      {result.unremembered.length > 0 && (
        <p className="mt-1 text-sm text-ink-soft">
          Matched for this file only:{" "}
          {result.unremembered.map((r, i) => (
            <span key={`${r.kind}:${r.value}`}>
              {i > 0 && "; "}“{r.value}” ({r.reason})
            </span>
          ))}
          .
        </p>
      )}
      <p className="mt-1 text-sm text-ink-soft">
        The file itself is kept with the session, so every value can be traced back to it.
      </p>
      <div className="mt-4 flex flex-wrap gap-2">
        <Link href={`/sessions/${sessionId}`} className="btn-primary">
          Back to the Session sheet
        </Link>
        <button type="button" className="btn-quiet" onClick={onAnother}>
          Import another file
        </button>
      </div>
    </section>
  );
}
