"use client";

import { SegmentError } from "@/components/segment-error";

export default function OutboxError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="Outbox" error={error} retry={() => (retry ?? reset)?.()} />;
}
