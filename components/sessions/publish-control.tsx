"use client";

import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import type { SessionStatus } from "@/lib/domain";
import type { SheetData } from "@/lib/client/api-types";
import { fetchJson } from "@/hooks/use-api";

/**
 * Owner and scientist: publish a session to its athletes, or take it back to draft.
 * Always behind a confirm step, because publishing shows results to athletes.
 */
export function PublishControl({
  sessionId,
  status,
  version,
  squadName,
  onDone,
  compact = false,
}: {
  sessionId: number;
  status: SessionStatus;
  /** The version read; when unknown (lists), the session is read first. */
  version?: number;
  squadName: string;
  onDone: () => void;
  compact?: boolean;
}) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const publishing = status === "draft";

  async function confirm() {
    setBusy(true);
    setFailure(null);
    try {
      const current = version ?? (await fetchJson<SheetData>(`/api/sessions/${sessionId}`)).session.version;
      await fetchJson(`/api/sessions/${sessionId}`, {
        method: "PATCH",
        body: JSON.stringify({ status: publishing ? "published" : "draft", version: current }),
      });
      setOpen(false);
      onDone();
    } catch (e) {
      setFailure(e instanceof Error ? e.message : "The change failed.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <>
      <button
        type="button"
        className={`${publishing && !compact ? "btn-primary" : "btn-quiet"} ${compact ? "px-2 py-1 text-xs" : ""}`}
        onClick={() => setOpen(true)}
      >
        {publishing ? "Publish…" : "Back to draft…"}
      </button>
      <Dialog open={open} title={publishing ? "Publish this session?" : "Take this session back to draft?"} onClose={() => setOpen(false)}>
        <div className="space-y-3 text-sm">
          {publishing ? (
            <>
              <p>
                The athletes of <strong>{squadName}</strong> will see their own results from this session on My progress.
                Each athlete sees only their own scores.
              </p>
              <p>Check the Session sheet first: flagged and out-of-range scores will be visible to them as they are.</p>
            </>
          ) : (
            <p>
              The athletes of <strong>{squadName}</strong> will no longer see these results until the session is published again.
            </p>
          )}
          <FormAlert message={failure} />
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet" onClick={() => setOpen(false)}>Cancel</button>
            <button type="button" className="btn-primary" disabled={busy} onClick={confirm}>
              {busy ? "Saving…" : publishing ? "Publish to athletes" : "Back to draft"}
            </button>
          </div>
        </div>
      </Dialog>
    </>
  );
}
