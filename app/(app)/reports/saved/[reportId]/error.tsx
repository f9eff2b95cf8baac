"use client";

import { SegmentError } from "@/components/segment-error";

export default function SavedReportError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The saved report" error={error} retry={() => (retry ?? reset)?.()} />;
}
