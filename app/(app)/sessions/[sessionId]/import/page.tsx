import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Breadcrumbs } from "@/components/breadcrumbs";
import { ImportFlow } from "@/components/import/import-flow";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard, pageId } from "@/lib/auth/page-guard";
import { canEditTestLibrary } from "@/lib/auth/permissions";
import { getImportSession, loadImportContext } from "@/lib/data/import";
import { ApiError } from "@/lib/errors";
import { formatDate, PHASE_LABELS, STATUS_LABELS } from "@/lib/labels";

export const metadata: Metadata = { title: "Import" };

async function load(sessionId: number) {
  const actor = await pageGuard({ roles: STAFF, sessionId });
  try {
    const session = await getImportSession(actor, sessionId);
    return { session, context: await loadImportContext(session), canRememberTests: canEditTestLibrary(actor) };
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) notFound();
    throw error;
  }
}

export default async function ImportPage({ params }: { params: Promise<{ sessionId: string }> }) {
  const { session, context, canRememberTests } = await load(pageId((await params).sessionId));

  return (
    <section aria-labelledby="import-heading" className="space-y-4">
      <Breadcrumbs
        trail={[
          { href: "/sessions", label: "Sessions" },
          { href: `/sessions/${session.id}`, label: "Session sheet" },
          { label: "Import" },
        ]}
      />
      <div>
        <h1 id="import-heading" className="text-2xl font-bold">
          Import
        </h1>
        <p className="text-ink-soft">
          <span className="font-semibold text-ink">{session.squadName}</span> · {PHASE_LABELS[session.phase]} ·{" "}
          <span className="num">{formatDate(session.date)}</span> · {STATUS_LABELS[session.status]} ·{" "}
          <span className="num">{context.athletes.length}</span> athletes on the roster · battery:{" "}
          {context.tests.map((t) => t.name).join(", ") || "none yet"}
        </p>
      </div>

      {!session.canImport ? (
        <div className="card max-w-2xl p-6">
          <h2 className="text-lg font-bold">This session is published</h2>
          <p className="mt-2 text-sm text-ink-soft">
            A sport scientist or the owner can import into a published session. Ask one of them, or import into a draft
            session.
          </p>
          <Link href={`/sessions/${session.id}`} className="btn-quiet mt-4">
            Back to the Session sheet
          </Link>
        </div>
      ) : context.tests.length === 0 ? (
        <div className="card max-w-2xl p-6">
          <h2 className="text-lg font-bold">No tests in this session's battery</h2>
          <p className="mt-2 text-sm text-ink-soft">
            Add tests to the session first; a file can only fill tests the session measures.
          </p>
          <Link href={`/sessions/${session.id}`} className="btn-quiet mt-4">
            Back to the Session sheet
          </Link>
        </div>
      ) : (
        <>
          <details className="card p-4 text-sm">
            <summary className="cursor-pointer font-semibold">What the file can look like</summary>
            <div className="mt-2 grid gap-4 md:grid-cols-2">
              <div>
                <p className="font-semibold">Long: one row per trial</p>
                <pre className="num mt-1 overflow-x-auto rounded bg-paper p-2 text-xs">{`athlete,test,trial,value\nNHA001,Countermovement jump,1,41.2\nNHA001,Countermovement jump,2,42.0\nCallum Adeyemi,10 m sprint,1,1.82`}</pre>
              </div>
              <div>
                <p className="font-semibold">Wide: one column per test or test-trial</p>
                <pre className="num mt-1 overflow-x-auto rounded bg-paper p-2 text-xs">{`athlete;Countermovement jump 1;Countermovement jump 2;10 m sprint\nNHA001;41,2;42,0;1,82`}</pre>
              </div>
            </div>
            <ul className="mt-3 list-disc space-y-1 pl-5 text-ink-soft">
              <li>
                Athletes are matched on the {session.squadName} roster by external id, then by name (capitals and spaces
                do not matter), then by other names remembered from earlier files. Nobody is added; a name the roster
                does not know can be matched to an athlete before importing.
              </li>
              <li>
                Tests are matched by name, or by an other name from the Test library (such as “CMJ”), within this
                session's battery. “Countermovement jump #2” and “Countermovement jump (trial 2)” also work; a plain
                test name is trial 1.
              </li>
              <li>
                , ; tab or | between columns; in files separated by ; or tab a comma is a decimal comma. Empty cells are
                empty trials.
              </li>
              <li>Scores already stored are never replaced unless you say so.</li>
              <li>
                The file holds personal data. It is kept with this session as the record of where the scores came from,
                and is deleted with the session; upload only what your consent and data-protection rules allow.
              </li>
            </ul>
          </details>
          <ImportFlow sessionId={session.id} canRememberTests={canRememberTests} />
        </>
      )}
    </section>
  );
}
