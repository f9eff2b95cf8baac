"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { Breadcrumbs } from "@/components/breadcrumbs";
import { Dialog } from "@/components/dialog";
import { DeleteSession } from "@/components/sessions/delete-session";
import { PublishControl } from "@/components/sessions/publish-control";
import { SessionEditForm } from "@/components/sessions/session-edit-form";
import { useSessionSheet } from "@/hooks/use-session-sheet";
import { formatDate, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";
import { MissingScores } from "./missing-scores";
import { RecentChanges } from "./recent-changes";
import { SheetGrid } from "./sheet-grid";
import { UndoButton } from "./undo-button";
import { useSuspects } from "./use-suspects";

/** The Session sheet: fast, keyboard-first score entry for one testing session. */
export function SessionSheet({ sessionId }: { sessionId: number }) {
  const sheet = useSessionSheet(sessionId);
  const { data } = sheet;
  const [testFilter, setTestFilter] = useState<number | "all">("all");
  const [announcement, setAnnouncement] = useState("");
  const [editing, setEditing] = useState(false);
  const tests = useMemo(
    () => (testFilter === "all" ? data.tests : data.tests.filter((t) => t.id === testFilter)),
    [data, testFilter],
  );

  const { session } = data;
  const filled = data.results.filter((r) => r.value !== null || r.flag !== null).length;
  const expected = data.athletes.length * data.tests.length;
  const refused = Object.keys(sheet.invalid).length;
  const unsaved = Object.values(sheet.cells).filter((c) => c.status === "failed" || c.status === "conflict").length;
  const { suspects, count: suspectCount, news } = useSuspects(data, sheet.shownFor);

  const message = [
    announcement,
    refused > 0 &&
      `${refused} cell${refused === 1 ? " holds" : "s hold"} text that is not a number and ${refused === 1 ? "was" : "were"} not saved.`,
    unsaved > 0 && `${unsaved} result${unsaved === 1 ? " needs" : "s need"} your attention below.`,
    news,
    sheet.waiting > 0 &&
      `No connection: ${sheet.waiting} ${sheet.waiting === 1 ? "result is" : "results are"} kept in this browser and will be sent when the network is back.`,
  ]
    .filter(Boolean)
    .join(" ");

  return (
    <section aria-labelledby="sheet-heading" className="space-y-3">
      <Breadcrumbs
        trail={[
          { href: "/sessions", label: "Sessions" },
          { href: `/squads/${session.squadId}`, label: session.squadName },
        ]}
      />
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 id="sheet-heading" className="text-2xl font-bold">
            Session sheet
          </h1>
          <p className="text-ink-soft">
            <span className="font-semibold text-ink">{session.squadName}</span> · {PHASE_LABELS[session.phase]} ·{" "}
            <span className="num">{formatDate(session.date)}</span> ·{" "}
            <span
              className={`rounded px-1.5 py-0.5 text-xs font-semibold ${session.status === "published" ? "bg-ink text-white" : "bg-band text-ink"}`}
            >
              {STATUS_LABELS[session.status]}
            </span>{" "}
            · <span className="num">{filled}</span> of <span className="num">{expected}</span> results
            {sheet.waiting > 0 && (
              <>
                {" "}
                ·{" "}
                <span className="rounded border border-dashed border-ink-soft px-1.5 py-0.5 text-sm font-semibold">
                  {sheet.waiting} waiting to send
                </span>
              </>
            )}
            {suspectCount > 0 && (
              <>
                {" "}
                ·{" "}
                <span className="rounded border border-dashed border-decline px-1.5 py-0.5 text-sm font-semibold">
                  {suspectCount} {suspectCount === 1 ? "score" : "scores"} to double-check
                </span>
              </>
            )}
          </p>
          {session.notes && <p className="mt-1 text-sm text-ink-soft">{session.notes}</p>}
        </div>
        <div className="flex flex-wrap items-center gap-2">
          {data.canEdit && (
            <>
              <UndoButton sheet={sheet} onMessage={setAnnouncement} />
              <button type="button" className="btn-quiet" onClick={() => setEditing(true)}>
                Edit session
              </button>
              <Link href={`/sessions/${session.id}/import`} className="btn-quiet">
                Import CSV
              </Link>
            </>
          )}
          {data.canDelete && (
            <DeleteSession
              sessionId={session.id}
              date={session.date}
              squadName={session.squadName}
              results={data.results.length}
            />
          )}
          {data.canPublish && (
            <PublishControl
              sessionId={session.id}
              status={session.status}
              version={session.version}
              squadName={session.squadName}
            />
          )}
        </div>
      </div>

      {/* Once per sheet, folded: the whole caution is one click away, not a paragraph above every sheet. */}
      <details className="text-xs text-ink-soft">
        <summary className="w-fit cursor-pointer font-semibold">
          <span aria-hidden>⚠︎ </span>Maximal tests carry injury risk — read before testing
        </summary>
        <p className="mt-1 max-w-3xl">
          Sprints, jumps, 1RM lifts and intermittent runs are maximal efforts: screen athletes, warm up, and test under
          qualified supervision, following your organisation&apos;s and governing body&apos;s protocols. Scores support
          training decisions; they are not a medical or return-to-play judgement — defer to your medical staff and
          licensed practitioners.
        </p>
      </details>

      {data.canEdit && session.status === "published" && (
        <p role="note" className="rounded-md border border-ink bg-band px-3 py-2 text-sm">
          <strong>Published:</strong> athletes see every change you save here on My progress at once. No new mail goes
          out; take the session back to draft and publish again to mail those whose results changed.
        </p>
      )}

      {!data.canEdit && (
        <p className="rounded-md border border-line bg-band px-3 py-2 text-sm">
          Read only: your account cannot change the scores of this session
          {session.status === "published" ? " (it is published to athletes)" : ""}.
        </p>
      )}

      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="flex items-center gap-2">
          <label htmlFor="sheet-test-filter" className="text-sm font-semibold">
            Show
          </label>
          <select
            id="sheet-test-filter"
            className="field w-auto py-1.5"
            value={testFilter}
            onChange={(e) => setTestFilter(e.target.value === "all" ? "all" : Number(e.target.value))}
          >
            <option value="all">All tests</option>
            {data.tests.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </select>
        </div>
        {/* The keyboard hint and what just happened share one slot beside Show, so a message never
            pushes the sheet down while someone types. */}
        <div className="grid min-h-10 min-w-64 flex-1">
          {data.canEdit && (
            <p className={`text-xs text-ink-soft [grid-area:1/1] sm:text-right ${message ? "invisible" : ""}`}>
              Type a score, <kbd className="rounded border border-line px-1">Tab</kbd> to the next trial,{" "}
              <kbd className="rounded border border-line px-1">Enter</kbd> for the next athlete. Decimal commas are
              fine; paste a block from a spreadsheet into the first cell.
            </p>
          )}
          <p aria-live="polite" className="text-sm [grid-area:1/1] sm:text-right">
            {message}
          </p>
        </div>
      </div>

      <MissingScores data={data} shownFor={sheet.shownFor} />

      <SheetGrid
        data={data}
        tests={tests}
        sheet={sheet}
        canEdit={data.canEdit}
        onAnnounce={setAnnouncement}
        suspects={suspects}
      />

      <RecentChanges sessionId={session.id} />

      {data.canEdit && (
        <Dialog open={editing} title="Edit session" onClose={() => setEditing(false)} wide>
          {editing && (
            <SessionEditForm
              data={data}
              onDone={() => {
                setEditing(false);
                setAnnouncement("The session was saved.");
              }}
            />
          )}
        </Dialog>
      )}
    </section>
  );
}
