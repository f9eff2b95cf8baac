/** Skeleton for a titled table while a segment loads. */
export function TableLoading({ label, rows = 6 }: { label: string; rows?: number }) {
  return (
    <div role="status" className="space-y-3">
      <div className="h-7 w-56 animate-pulse rounded bg-line" />
      <div className="card divide-y divide-line">
        {Array.from({ length: rows }, (_, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: placeholder rows with nothing but their position
          <div key={i} className="flex gap-4 px-4 py-3">
            <div className="h-4 w-40 animate-pulse rounded bg-line/70" />
            <div className="h-4 flex-1 animate-pulse rounded bg-line/40" />
          </div>
        ))}
      </div>
      <span className="sr-only">Loading {label}…</span>
    </div>
  );
}
