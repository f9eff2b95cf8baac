"use client";

import { SegmentError } from "@/components/segment-error";

export default function ReliabilityError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Reliability check" error={error} retry={() => (retry ?? reset)?.()} />;
}
