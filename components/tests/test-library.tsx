"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Dialog } from "@/components/dialog";
import { QueryStatus } from "@/components/query-status";
import { type Column, PhoneFacts, TableCard, WIDE_ONLY } from "@/components/table-card";
import { type TestItem, testQueries } from "@/lib/client/queries";
import { formatDate, PHASE_LABELS, trialRuleWords } from "@/lib/labels";
import { directionWords, rangeWords, swcWords, typicalErrorWords } from "@/lib/words/tests";
import { TestForm } from "./test-form";
import { TestRowActions } from "./test-row-actions";

// Below 1280 px the unit, direction, trials and range move into the Test cell, so the table
// fits a tablet with its Results and actions on screen; below `sm` (a phone) the rest follow.
const WIDE = "hidden xl:table-cell";
const COLUMNS: Column[] = [
  { label: "Test" },
  { label: "Unit", className: WIDE },
  { label: "Direction", className: WIDE },
  { label: "Trials", className: WIDE },
  { label: "SWC", className: WIDE_ONLY },
  { label: "Typical error", className: WIDE_ONLY },
  { label: "Plausible range", className: WIDE },
  { label: "Results", align: "right", className: WIDE_ONLY },
];

/** The Test library: every test of the organisation; owner and scientist may change it. */
export function TestLibrary({ canEdit }: { canEdit: boolean }) {
  const [showArchived, setShowArchived] = useState(false);
  const [editing, setEditing] = useState<TestItem | "new" | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const tests = useQuery({ ...testQueries.list({ archived: showArchived }), placeholderData: keepPreviousData });

  function saved(test: { name: string }) {
    setNotice(editing === "new" ? `${test.name} was added to the Test library.` : `${test.name} was saved.`);
    setEditing(null);
  }

  return (
    <section aria-labelledby="tests-heading" className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <div>
          <h1 id="tests-heading" className="text-2xl font-bold">
            Test library
          </h1>
          <p className="text-sm text-ink-soft">
            Each test knows its unit, which direction is better, how trials are reduced and how noisy it is.
            {!canEdit && " Your sport scientist keeps this library; you can read it."}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
            Show archived
          </label>
          {canEdit && (
            <button type="button" className="btn-primary" onClick={() => setEditing("new")}>
              New test
            </button>
          )}
        </div>
      </div>

      {notice && (
        <p role="status" className="rounded-md border border-line bg-band px-3 py-2 text-sm">
          {notice}
        </p>
      )}
      <QueryStatus
        query={tests}
        loading="Loading the Test library…"
        failure="The Test library could not load"
        empty={tests.data?.length === 0 && `No tests yet.${canEdit ? " Add the first one with “New test”." : ""}`}
      />
      {tests.data && tests.data.length > 0 && (
        <TableCard columns={canEdit ? [...COLUMNS, { label: "Actions", srOnly: true, className: WIDE_ONLY }] : COLUMNS}>
          {tests.data.map((test) => {
            const dir = directionWords(test.direction);
            const te = typicalErrorWords(test);
            const range = rangeWords(test);
            const swc = <SwcWords test={test} />;
            const typicalError = <TypicalErrorWords test={test} words={te} />;
            const results = <span className="num">{test.resultCount}</span>;
            const actions = canEdit && (
              <TestRowActions test={test} onEdit={() => setEditing(test)} onNotice={setNotice} />
            );
            return (
              <tr
                key={test.id}
                className={`border-b border-line align-top last:border-0 ${test.archived ? "bg-paper text-ink-faint" : ""}`}
              >
                <td className="px-3 py-2.5">
                  <span className="font-semibold">{test.name}</span>
                  {test.archived && (
                    <span className="ml-2 rounded bg-steady-soft px-1.5 py-0.5 text-xs text-ink-soft">Archived</span>
                  )}
                  <div className="text-xs text-ink-faint">
                    {test.decimals} decimal{test.decimals === 1 ? "" : "s"}
                  </div>
                  {test.aliases.length > 0 && (
                    <div className="text-xs text-ink-soft">In files also: {test.aliases.join(", ")}</div>
                  )}
                  <div className="text-xs text-ink-soft xl:hidden">
                    {test.unit} · <span aria-hidden>{dir.arrow} </span>
                    {dir.words} · {trialRuleWords(test.trialRule, test.trialsPerSession)}
                    {range && ` · plausible ${range}`}
                  </div>
                  <PhoneFacts
                    facts={[
                      { label: "SWC", value: swc },
                      { label: "Typical error", value: typicalError },
                      { label: "Results", value: results },
                    ]}
                    actions={actions}
                  />
                </td>
                <td className={`px-3 py-2.5 ${WIDE}`}>{test.unit}</td>
                <td className={`whitespace-nowrap px-3 py-2.5 ${WIDE}`}>
                  <span aria-hidden className="mr-1 font-bold">
                    {dir.arrow}
                  </span>
                  {dir.words}
                </td>
                <td className={`whitespace-nowrap px-3 py-2.5 ${WIDE}`}>
                  {trialRuleWords(test.trialRule, test.trialsPerSession)}
                </td>
                <td className={`px-3 py-2.5 ${WIDE_ONLY}`}>{swc}</td>
                <td className={`min-w-40 px-3 py-2.5 ${WIDE_ONLY}`}>{typicalError}</td>
                <td className={`num whitespace-nowrap px-3 py-2.5 ${WIDE}`}>
                  {range ?? <span className="text-ink-faint">Any</span>}
                </td>
                <td className={`px-3 py-2.5 text-right ${WIDE_ONLY}`}>{results}</td>
                {canEdit && <td className={`px-3 py-2.5 ${WIDE_ONLY}`}>{actions}</td>}
              </tr>
            );
          })}
        </TableCard>
      )}

      <Dialog
        open={editing !== null}
        wide
        title={editing === "new" ? "New test" : editing ? `Edit ${editing.name}` : ""}
        onClose={() => setEditing(null)}
      >
        {editing !== null && (
          <TestForm
            key={editing === "new" ? "new" : editing.id}
            test={editing === "new" ? null : editing}
            onDone={saved}
          />
        )}
      </Dialog>
    </section>
  );
}

/** The SWC method, and the value it gives today. */
function SwcWords({ test }: { test: TestItem }) {
  return (
    <>
      <span className="whitespace-nowrap">{swcWords(test)}</span>
      <CurrentSwcWords test={test} />
    </>
  );
}

/** The typical error, or where to measure it, and where it came from. */
function TypicalErrorWords({ test, words }: { test: TestItem; words: string | null }) {
  return (
    <>
      {words ? (
        <span className="num">{words}</span>
      ) : (
        <>
          <span className="text-ink-soft">Not set</span>
          <Link
            href={`/reports/reliability?testId=${test.id}`}
            className="block text-xs font-semibold underline underline-offset-2"
          >
            Measure it in a Reliability check
          </Link>
        </>
      )}
      {test.typicalErrorSource && <div className="max-w-56 text-xs text-ink-faint">{test.typicalErrorSource}</div>}
    </>
  );
}

/** The SWC the method gives today, in the test's unit, and the session it came from. */
function CurrentSwcWords({ test }: { test: TestItem }) {
  const current = test.currentSwc;
  if (!current) return null;
  if (current.value === null) {
    const why =
      test.swcMethod === "cv-factor" && current.from
        ? "No value yet: the test has no CV%."
        : "No value yet: no baseline or pre-block session has two scores.";
    return <div className="max-w-56 text-xs text-ink-soft">{why}</div>;
  }
  const value = Number(current.value.toFixed(test.decimals + 2));
  return (
    <div className="max-w-56 text-xs text-ink-soft">
      <span className="num font-semibold text-ink">
        = {value} {test.unit}
      </span>
      {current.from && (
        <>
          {" "}
          from {PHASE_LABELS[current.from.phase].toLowerCase()} {formatDate(current.from.date)},{" "}
          {current.from.squadName} (<span className="num">{current.from.n}</span> athletes)
        </>
      )}
    </div>
  );
}
