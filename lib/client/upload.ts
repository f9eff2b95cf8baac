"use client";

import { ApiClientError, apiErrorFrom } from "@/lib/client/fetch-json";

export type UploadProgress = { loaded: number; total: number; done: boolean };

/**
 * Posts the file with XMLHttpRequest (fetch cannot report upload progress) and answers like
 * fetchJson: the parsed JSON, or an ApiClientError carrying the error shape.
 */
export function uploadImport<T>(
  sessionId: number,
  mode: "preview" | "commit",
  file: File,
  fields: Record<string, string>,
  onProgress: (progress: UploadProgress) => void,
): Promise<T> {
  const form = new FormData();
  form.set("file", file, file.name);
  for (const [key, value] of Object.entries(fields)) form.set(key, value);
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/sessions/${sessionId}/import?mode=${mode}`);
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress({ loaded: event.loaded, total: event.total, done: false });
    };
    xhr.upload.onload = () => onProgress({ loaded: file.size, total: file.size, done: true });
    xhr.onerror = () =>
      reject(
        new ApiClientError(
          0,
          "network",
          "The upload did not reach the server. Check the connection and try again.",
          null,
        ),
      );
    xhr.onabort = () => reject(new ApiClientError(0, "aborted", "The upload was cancelled.", null));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        resolve(body as T);
        return;
      }
      reject(apiErrorFrom(xhr.status, body, `The import failed (${xhr.status}).`));
    };
    xhr.send(form);
  });
}

export const formatBytes = (bytes: number) =>
  bytes < 1024
    ? `${bytes} B`
    : bytes < 1024 * 1024
      ? `${(bytes / 1024).toFixed(1)} kB`
      : `${(bytes / 1024 / 1024).toFixed(1)} MB`;
