"use client";

import { SegmentError } from "@/components/segment-error";

export default function ImportError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="Import" error={error} retry={() => (retry ?? reset)?.()} />;
}
