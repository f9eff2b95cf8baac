"use client";

import { SegmentError } from "@/components/segment-error";

export default function SessionsError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="Sessions" error={error} retry={() => (retry ?? reset)?.()} />;
}
