"use client";

import { SegmentError } from "@/components/segment-error";

export default function SessionSheetError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Session sheet" error={error} retry={() => (retry ?? reset)?.()} />;
}
