import Link from "next/link";

const MODES = [
  { key: "sessions", href: "/reports/reliability", label: "Two sessions in Changewise" },
  { key: "file", href: "/reports/reliability/file", label: "A two-trial file" },
] as const;

/** Where the Reliability check's scores come from: two stored sessions, or a file of two trials. */
export function ReliabilityModes({ current }: { current: (typeof MODES)[number]["key"] }) {
  return (
    <nav aria-label="Scores from" className="flex flex-wrap items-center gap-2 text-sm">
      <span className="font-semibold">Scores from</span>
      {MODES.map((mode) =>
        mode.key === current ? (
          <span key={mode.key} aria-current="page" className="rounded-full bg-ink px-3 py-1 font-semibold text-white">
            {mode.label}
          </span>
        ) : (
          <Link key={mode.key} href={mode.href} className="rounded-full border border-control px-3 py-1 hover:bg-paper">
            {mode.label}
          </Link>
        ),
      )}
    </nav>
  );
}
