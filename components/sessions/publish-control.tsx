"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { FormAlert } from "@/components/form-bits";
import { useUpdateSession } from "@/hooks/use-writes";
import { sessionQueries } from "@/lib/client/queries";
import type { SessionStatus } from "@/lib/domain";
import { formatValue } from "@/lib/labels";
import { CONSENT_MISSING_WORDS } from "@/lib/words/progress";
import { suspectSentence } from "@/lib/words/suspect";

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
              {open && <Audience sessionId={sessionId} />}
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

/** Who will see their results and get mail, and who will not and why: read when the dialog opens. */
function Audience({ sessionId }: { sessionId: number }) {
  const { data, isPending, isError } = useQuery(sessionQueries.publishCheck(sessionId));
  if (isPending) return <p className="text-ink-soft">Checking consent and accounts…</p>;
  if (isError || !data) return <p className="text-ink-soft">Could not check consent and accounts just now.</p>;
  const { athletes } = data;
  const withheld = athletes.filter((a) => !a.consent.ok);
  const shown = athletes.length - withheld.length;
  const mailed = athletes.filter((a) => a.mail).length;
  const noAccount = athletes.filter((a) => a.consent.ok && !a.hasAccount).length;
  return (
    <div className="space-y-2 rounded-md border border-line p-3">
      <p>
        <span className="num font-semibold">{shown}</span> of <span className="num">{athletes.length}</span> athletes
        with results will see them; <span className="num font-semibold">{mailed}</span>{" "}
        {mailed === 1 ? "gets an e-mail" : "get an e-mail"} with their own numbers only
        {noAccount > 0 && (
          <>
            {" "}
            (<span className="num">{noAccount}</span> {noAccount === 1 ? "has" : "have"} no account yet, so no mail)
          </>
        )}
        .
      </p>
      {data.republishing && (
        <p className="text-ink-soft">
          Published before: only athletes whose results changed since then get a mail, saying their results were
          updated.
        </p>
      )}
      {data.suspects.length > 0 && (
        <div>
          <p className="font-semibold">
            <span className="num">{data.suspects.length}</span>{" "}
            {data.suspects.length === 1 ? "score to double-check" : "scores to double-check"} before publishing:
          </p>
          <ul className="list-disc pl-5">
            {data.suspects.map((s) => (
              <li key={`${s.athleteId}-${s.testId}-${s.trial}`}>
                {s.athleteName}, {s.test.name}
                {s.test.trialsPerSession > 1 ? ` trial ${s.trial}` : ""}:{" "}
                <span className="num">
                  {formatValue(s.value, s.test.decimals)} {s.test.unit}
                </span>{" "}
                — {suspectSentence(s.reasons, s.test)}
              </li>
            ))}
          </ul>
        </div>
      )}
      {data.missing.length > 0 && (
        <div>
          <p className="font-semibold">Missing scores (no score and no flag):</p>
          <ul className="list-disc pl-5">
            {data.missing.map((a) => (
              <li key={a.athleteId}>
                {a.name}: {a.tests.join(", ")}
              </li>
            ))}
          </ul>
        </div>
      )}
      {withheld.length > 0 && (
        <div>
          <p className="font-semibold">Not shown to them and not mailed — consent missing:</p>
          <ul className="list-disc pl-5">
            {withheld.map((a) => (
              <li key={a.id}>
                {a.name}: {a.consent.missing.map((m) => CONSENT_MISSING_WORDS[m]).join("; ")}
              </li>
            ))}
          </ul>
          <p className="text-ink-soft">Record consent on the Roster; they will see their results once it is there.</p>
        </div>
      )}
    </div>
  );
}
