"use client";

import { SegmentError } from "@/components/segment-error";

export default function ReliabilityFileError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Reliability check of a file" error={error} retry={() => (retry ?? reset)?.()} />;
}
