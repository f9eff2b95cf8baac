export default function Loading() {
  return (
    <p className="text-center text-sm text-ink-soft" role="status">
      Loading…
    </p>
  );
}
