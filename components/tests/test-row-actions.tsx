"use client";

import { useState } from "react";
import type { TestItem } from "@/lib/client/api-types";
import { fetchJson } from "@/hooks/use-api";
import { useInvalidate } from "@/hooks/use-invalidate";

/** Edit, archive or restore a test; delete is offered only while no result uses it. */
export function TestRowActions({
  test,
  onEdit,
  onNotice,
}: {
  test: TestItem;
  onEdit: () => void;
  onNotice: (message: string) => void;
}) {
  const [busy, setBusy] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const invalidate = useInvalidate();

  async function run(action: () => Promise<string>) {
    setBusy(true);
    try {
      onNotice(await action());
    } catch (error) {
      onNotice(`${test.name}: ${error instanceof Error ? error.message : "the change failed"}`);
    } finally {
      await invalidate("/api/tests");
      setBusy(false);
      setConfirmDelete(false);
    }
  }

  const setArchived = (archived: boolean) =>
    run(async () => {
      await fetchJson(`/api/tests/${test.id}`, { method: "PATCH", body: JSON.stringify({ archived, version: test.version }) });
      return archived ? `${test.name} was archived. Its results stay; it is no longer offered for new sessions.` : `${test.name} was restored.`;
    });

  const remove = () =>
    run(async () => {
      const answer = await fetchJson<{ deleted?: boolean; archived?: boolean }>(`/api/tests/${test.id}`, { method: "DELETE" });
      return answer.archived ? `${test.name} has results, so it was archived instead of deleted.` : `${test.name} was deleted.`;
    });

  if (confirmDelete) {
    return (
      <div className="flex items-center justify-end gap-2 whitespace-nowrap">
        <span className="text-xs">Delete for good?</span>
        <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={busy} onClick={remove}>Delete</button>
        <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setConfirmDelete(false)}>Keep</button>
      </div>
    );
  }
  return (
    <div className="flex justify-end gap-1.5 whitespace-nowrap">
      <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={busy} onClick={onEdit} aria-label={`Edit ${test.name}`}>
        Edit
      </button>
      <button
        type="button"
        className="btn-quiet px-2 py-1 text-xs"
        disabled={busy}
        onClick={() => setArchived(!test.archived)}
        aria-label={`${test.archived ? "Restore" : "Archive"} ${test.name}`}
      >
        {test.archived ? "Restore" : "Archive"}
      </button>
      {test.resultCount === 0 && (
        <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={busy} onClick={() => setConfirmDelete(true)} aria-label={`Delete ${test.name}`}>
          Delete
        </button>
      )}
    </div>
  );
}
