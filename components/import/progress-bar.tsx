"use client";

import { formatBytes, type UploadProgress } from "@/lib/client/upload";

/** Upload progress; once the bytes are sent, the server is still reading the file. */
export function ProgressBar({ progress, label }: { progress: UploadProgress | null; label: string }) {
  const percent = progress && progress.total > 0 ? Math.round((progress.loaded / progress.total) * 100) : 0;
  const checking = progress?.done ?? false;
  return (
    <div className="space-y-1" aria-live="polite">
      <div className="flex justify-between text-sm">
        <span className="font-semibold">
          {checking ? `${label}: reading the file on the server…` : `${label}: uploading…`}
        </span>
        {progress && !checking && (
          <span className="num text-ink-soft">
            {formatBytes(progress.loaded)} of {formatBytes(progress.total)} · {percent} %
          </span>
        )}
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={checking ? undefined : percent}
        className="h-2.5 overflow-hidden rounded-full bg-steady-soft"
      >
        <div
          className={`h-full rounded-full bg-gain transition-[width] duration-200 ${checking ? "animate-pulse" : ""}`}
          style={{ width: `${checking ? 100 : percent}%` }}
        />
      </div>
    </div>
  );
}
