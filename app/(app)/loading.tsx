export default function Loading() {
  return (
    <div role="status" className="space-y-3">
      <div className="h-7 w-48 animate-pulse rounded bg-line" />
      <div className="h-32 animate-pulse rounded-lg bg-white" />
      <span className="sr-only">Loading…</span>
    </div>
  );
}
