"use client";

import { useState } from "react";
import { useDeleteTest, useUpdateTest } from "@/hooks/use-writes";
import type { TestItem } from "@/lib/client/queries";

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
  const [confirmDelete, setConfirmDelete] = useState(false);
  const update = useUpdateTest();
  const remove = useDeleteTest();
  const busy = update.isPending || remove.isPending;
  const settled = {
    onError: (error: Error) => onNotice(`${test.name}: ${error.message}`),
    onSettled: () => setConfirmDelete(false),
  };

  const setArchived = (archived: boolean) =>
    update.mutate(
      { testId: test.id, input: { archived, version: test.version } },
      {
        ...settled,
        onSuccess: () =>
          onNotice(
            archived
              ? `${test.name} was archived. Its results stay; it is no longer offered for new sessions.`
              : `${test.name} was restored.`,
          ),
      },
    );

  const deleteTest = () =>
    remove.mutate(test.id, {
      ...settled,
      onSuccess: (answer) =>
        onNotice(
          "archived" in answer
            ? `${test.name} has results, so it was archived instead of deleted.`
            : `${test.name} was deleted.`,
        ),
    });

  if (confirmDelete) {
    return (
      <div className="flex flex-wrap items-center gap-2 sm:flex-nowrap sm:justify-end">
        <span className="text-xs">Delete for good?</span>
        <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={busy} onClick={deleteTest}>
          Delete
        </button>
        <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setConfirmDelete(false)}>
          Keep
        </button>
      </div>
    );
  }
  return (
    <div className="flex flex-wrap gap-1.5 sm:flex-nowrap sm:justify-end">
      <button
        type="button"
        className="btn-quiet px-2 py-1 text-xs"
        disabled={busy}
        onClick={onEdit}
        aria-label={`Edit ${test.name}`}
      >
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
        <button
          type="button"
          className="btn-quiet px-2 py-1 text-xs"
          disabled={busy}
          onClick={() => setConfirmDelete(true)}
          aria-label={`Delete ${test.name}`}
        >
          Delete
        </button>
      )}
    </div>
  );
}
