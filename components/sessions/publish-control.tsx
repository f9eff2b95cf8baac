"use client";

import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import { useUpdateSession } from "@/hooks/use-writes";
import type { SessionStatus } from "@/lib/domain";

/**
 * Owner and scientist: publish a session to its athletes, or take it back to draft.
 * Always behind a confirm step, because publishing shows results to athletes.
 */
export function PublishControl({
  sessionId,
  status,
  version,
  squadName,
  compact = false,
}: {
  sessionId: number;
  status: SessionStatus;
  /** The version the screen read: a change made since by someone else is refused, not overwritten. */
  version: number;
  squadName: string;
  compact?: boolean;
}) {
  const [open, setOpen] = useState(false);
  const update = useUpdateSession();
  const publishing = status === "draft";
  const busy = update.isPending;
  const failure = update.error ? update.error.message : null;

  function confirm() {
    update.mutate(
      { sessionId, input: { status: publishing ? "published" : "draft", version } },
      { onSuccess: () => setOpen(false) },
    );
  }

  return (
    <>
      <button
        type="button"
        className={`${publishing && !compact ? "btn-primary" : "btn-quiet"} ${compact ? "px-2 py-1 text-xs" : ""}`}
        onClick={() => {
          update.reset();
          setOpen(true);
        }}
      >
        {publishing ? "Publish…" : "Back to draft…"}
      </button>
      <Dialog
        open={open}
        title={publishing ? "Publish this session?" : "Take this session back to draft?"}
        onClose={() => setOpen(false)}
      >
        <div className="space-y-3 text-sm">
          {publishing ? (
            <>
              <p>
                The athletes of <strong>{squadName}</strong> will see their own results from this session on My
                progress. Each athlete sees only their own scores.
              </p>
              <p>Check the Session sheet first: flagged and out-of-range scores will be visible to them as they are.</p>
            </>
          ) : (
            <p>
              The athletes of <strong>{squadName}</strong> will no longer see these results until the session is
              published again.
            </p>
          )}
          <FormAlert message={failure} />
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet" onClick={() => setOpen(false)}>
              Cancel
            </button>
            <button type="button" className="btn-primary" disabled={busy} onClick={confirm}>
              {busy ? "Saving…" : publishing ? "Publish to athletes" : "Back to draft"}
            </button>
          </div>
        </div>
      </Dialog>
    </>
  );
}
