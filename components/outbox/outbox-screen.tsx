"use client";

import { useQuery, useSuspenseQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Dialog, DialogCancel } from "@/components/dialog";
import { LoadFailure } from "@/components/query-status";
import { type Column, TableCard } from "@/components/table-card";
import { type OutboxData, outboxQueries } from "@/lib/client/queries";
import type { MailKind } from "@/lib/domain";
import { formatMoment } from "@/lib/labels";

const KIND_LABELS: Record<MailKind, string> = {
  invitation: "Invitation",
  "password-reset": "Password reset",
  "results-published": "New results",
  "deletion-request": "Deletion request",
};

const STATE_LABELS: Record<OutboxData["queue"][number]["state"], string> = {
  waiting: "Waiting",
  retrying: "Retrying",
  sent: "Sent",
};

/** Outbox (owner): mail the organisation sent or is about to send; with the local fake, the messages themselves. */
export function OutboxScreen() {
  const { data } = useSuspenseQuery(outboxQueries.list());
  const [reading, setReading] = useState<string | null>(null);
  return (
    <section aria-labelledby="outbox-heading" className="space-y-6">
      <div>
        <h1 id="outbox-heading" className="text-2xl font-bold">
          Outbox
        </h1>
        <p className="text-sm text-ink-soft">
          {data.localFake
            ? "Mail goes to the local mail catcher on this machine, not to anyone's inbox: every message lands here. Use it for trying things out."
            : "Mail goes to the SMTP server set for this installation. Below is what your organisation's mail is doing: waiting, retried after a failure, or sent."}
        </p>
      </div>
      {data.localFake && <Captured messages={data.messages} onRead={setReading} />}
      <Queue queue={data.queue} />
      <p className="border-t border-line pt-4 text-xs leading-relaxed text-ink-soft">
        Mail can hold personal data and one-time links. Once sent, a message&apos;s text is no longer kept in the queue.
      </p>
      <MessageDialog id={reading} onClose={() => setReading(null)} />
    </section>
  );
}

function Captured({ messages, onRead }: { messages: OutboxData["messages"]; onRead: (id: string) => void }) {
  const columns: Column[] = [{ label: "To" }, { label: "Subject" }, { label: "Date" }, { label: "Open", srOnly: true }];
  return (
    <section aria-labelledby="captured-heading" className="space-y-2">
      <h2 id="captured-heading" className="text-lg font-bold">
        Captured messages ({messages.length})
      </h2>
      {messages.length === 0 ? (
        <p className="text-sm text-ink-soft">No message yet. Invite someone from People to see one arrive.</p>
      ) : (
        <TableCard columns={columns}>
          {messages.map((m) => (
            <tr key={m.id} className="border-b border-line last:border-0 align-top">
              <td className="px-3 py-2 [overflow-wrap:anywhere]">{m.to}</td>
              <td className="px-3 py-2 font-semibold">{m.subject}</td>
              <td className="px-3 py-2 num whitespace-nowrap">{m.date ? formatMoment(Date.parse(m.date)) : "—"}</td>
              <td className="px-3 py-2 text-right">
                <button
                  type="button"
                  className="btn-quiet px-2 py-1 text-xs"
                  aria-label={`Read “${m.subject}” to ${m.to}`}
                  onClick={() => onRead(m.id)}
                >
                  Read
                </button>
              </td>
            </tr>
          ))}
        </TableCard>
      )}
    </section>
  );
}

function Queue({ queue }: { queue: OutboxData["queue"] }) {
  const columns: Column[] = [
    { label: "To" },
    { label: "Kind" },
    { label: "State" },
    { label: "Attempts", align: "right" },
    { label: "Queued" },
  ];
  return (
    <section aria-labelledby="queue-heading" className="space-y-2">
      <h2 id="queue-heading" className="text-lg font-bold">
        Queue ({queue.length})
      </h2>
      {queue.length === 0 ? (
        <p className="text-sm text-ink-soft">Your organisation has not sent any mail yet.</p>
      ) : (
        <TableCard columns={columns}>
          {queue.map((m) => (
            <tr key={m.id} className="border-b border-line last:border-0 align-top">
              <td className="px-3 py-2 [overflow-wrap:anywhere]">{m.to}</td>
              <td className="px-3 py-2">{KIND_LABELS[m.kind]}</td>
              <td className="px-3 py-2">
                <span className="font-semibold">{STATE_LABELS[m.state]}</span>
                {m.state === "sent" && m.sentAt !== null && <span className="block num">{formatMoment(m.sentAt)}</span>}
                {m.state !== "sent" && <span className="block num">next try {formatMoment(m.nextAttemptAt)}</span>}
                {m.lastError && <span className="block text-decline">Last error: {m.lastError}</span>}
              </td>
              <td className="px-3 py-2 text-right num">{m.attempts}</td>
              <td className="px-3 py-2 num whitespace-nowrap">{formatMoment(m.createdAt)}</td>
            </tr>
          ))}
        </TableCard>
      )}
    </section>
  );
}

function MessageDialog({ id, onClose }: { id: string | null; onClose: () => void }) {
  return (
    <Dialog open={id !== null} title="Message" onClose={onClose} wide>
      {id && <MessageBody id={id} />}
      <div className="mt-4 flex justify-end">
        <DialogCancel label="Done" />
      </div>
    </Dialog>
  );
}

/** The plain-text part: the HTML part would need a frame, and the pages' security policy allows none. */
function MessageBody({ id }: { id: string }) {
  const message = useQuery(outboxQueries.message(id));
  if (message.isPending) return <p role="status">Opening the message…</p>;
  if (message.error)
    return <LoadFailure failure="The message could not load" error={message.error} onRetry={message.refetch} />;
  const m = message.data;
  return (
    <div className="space-y-3 text-sm">
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        <dt className="font-semibold">From</dt>
        <dd className="break-all">{m.from}</dd>
        <dt className="font-semibold">To</dt>
        <dd className="break-all">{m.to}</dd>
        <dt className="font-semibold">Subject</dt>
        <dd>{m.subject}</dd>
        <dt className="font-semibold">Date</dt>
        <dd>{m.date}</dd>
      </dl>
      <pre className="whitespace-pre-wrap break-words rounded-md border border-line bg-band p-3 font-sans">
        {m.text ?? "This message has no plain-text part."}
      </pre>
    </div>
  );
}
