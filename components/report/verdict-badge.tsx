import type { Verdict } from "@/lib/stats";
import { VERDICT_LABELS } from "@/lib/words/stats";

// A word always, and an arrow for the direction: the colour is never the only carrier.
const LOOK: Record<Verdict, { className: string; mark: string }> = {
  "clear-gain": { className: "bg-gain text-white", mark: "▲▲" },
  gain: { className: "bg-gain-soft text-ink border border-gain", mark: "▲" },
  steady: { className: "bg-steady-soft text-ink border border-steady", mark: "◆" },
  decline: { className: "bg-decline-soft text-ink border border-decline", mark: "▼" },
  "clear-decline": { className: "bg-decline text-white", mark: "▼▼" },
  inconclusive: { className: "hatch-inconclusive text-ink", mark: "?" },
};

export function VerdictBadge({ verdict, large = false }: { verdict: Verdict | null; large?: boolean }) {
  if (verdict === null) return <span className="text-ink-faint">–</span>;
  const look = LOOK[verdict];
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded font-semibold ${large ? "px-2.5 py-1 text-base" : "px-1.5 py-0.5 text-xs"} ${look.className}`}
    >
      <span aria-hidden>{look.mark}</span>
      {VERDICT_LABELS[verdict]}
    </span>
  );
}
