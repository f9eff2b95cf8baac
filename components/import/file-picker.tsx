"use client";

import { useId, useState } from "react";
import { formatBytes } from "@/lib/client/upload";
import { MAX_IMPORT_BYTES, TOO_LARGE_MESSAGE } from "@/lib/import/limits";

/** Choose or drop one CSV file; files over the limit are refused here, before any upload. */
export function FilePicker({
  onFile,
  disabled,
  current,
}: {
  onFile: (file: File) => void;
  disabled?: boolean;
  current: File | null;
}) {
  const id = useId();
  const [problem, setProblem] = useState<string | null>(null);
  const [over, setOver] = useState(false);

  const take = (file: File | undefined) => {
    if (!file) return;
    if (file.size > MAX_IMPORT_BYTES) {
      setProblem(`${file.name} is ${formatBytes(file.size)}. ${TOO_LARGE_MESSAGE}`);
      return;
    }
    setProblem(null);
    onFile(file);
  };

  return (
    <div>
      {/* biome-ignore lint/a11y/noStaticElementInteractions: dropping a file is a pointer shortcut; the labelled file button inside does the same from the keyboard. */}
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          setOver(false);
          if (!disabled) take(e.dataTransfer.files[0]);
        }}
        className={`card flex flex-wrap items-center gap-3 border-dashed p-4 ${over ? "border-gain bg-gain-soft/40" : ""}`}
      >
        <label htmlFor={id} className="btn-primary cursor-pointer">
          {current ? "Choose another file" : "Choose a CSV file"}
        </label>
        <input
          id={id}
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          className="sr-only"
          disabled={disabled}
          onChange={(e) => {
            take(e.target.files?.[0]);
            e.target.value = "";
          }}
        />
        <p className="text-sm text-ink-soft">
          {current ? (
            <>
              <span className="font-semibold text-ink">{current.name}</span> ·{" "}
              <span className="num">{formatBytes(current.size)}</span>
            </>
          ) : (
            <>or drop it here. UTF-8 CSV, separated by , ; or tab, up to 10 MB.</>
          )}
        </p>
      </div>
      {problem && (
        <p role="alert" className="mt-2 rounded-md border border-decline bg-decline-soft px-3 py-2 text-sm">
          {problem}
        </p>
      )}
    </div>
  );
}
