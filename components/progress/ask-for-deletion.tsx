"use client";

import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import { useRequestDeletion } from "@/hooks/use-writes";

/**
 * The athlete asks their club to delete their record and results. It only sends the request:
 * the club's owner decides and deletes, as data-protection law gives the club duties too.
 */
export function AskForDeletion() {
  const [open, setOpen] = useState(false);
  const [message, setMessage] = useState("");
  const ask = useRequestDeletion();
  const sent = ask.isSuccess;

  return (
    <>
      {sent ? (
        <p role="status" className="text-sm">
          {ask.data?.created === false
            ? `You already asked on ${new Date(ask.data.request.requestedAt).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" })}; your club's owner has that request.`
            : "Your request has reached your club's owner."}{" "}
          They will delete your record and results, or tell you why something must be kept.
        </p>
      ) : (
        <button type="button" className="btn-quiet" onClick={() => setOpen(true)}>
          Ask for my data to be deleted…
        </button>
      )}
      <Dialog open={open} title="Ask your club to delete your data?" onClose={() => setOpen(false)}>
        <form
          className="space-y-3 text-sm"
          onSubmit={(event) => {
            event.preventDefault();
            ask.mutate({ message: message.trim() === "" ? null : message }, { onSuccess: () => setOpen(false) });
          }}
        >
          <p>
            Your club&apos;s owner gets your request by e-mail and on their People page. Deleting removes your athlete
            record, every result and your account, and cannot be undone — download your data first if you want to keep
            it. Your club may have to keep some records by law; the owner will tell you.
          </p>
          <label className="block">
            <span className="font-semibold">A message for the owner (optional)</span>
            <textarea
              className="field mt-1 h-24"
              value={message}
              maxLength={1000}
              onChange={(e) => setMessage(e.target.value)}
            />
          </label>
          <FormAlert message={ask.error ? ask.error.message : null} />
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet" onClick={() => setOpen(false)}>
              Cancel
            </button>
            <button type="submit" className="btn-primary" disabled={ask.isPending}>
              {ask.isPending ? "Sending…" : "Send the request"}
            </button>
          </div>
        </form>
      </Dialog>
    </>
  );
}
