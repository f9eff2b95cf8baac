"use client";

import { SegmentError } from "@/components/segment-error";

export default function ChangeReportError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Change report" error={error} retry={() => (retry ?? reset)?.()} />;
}
