"use client";

import { SegmentError } from "@/components/segment-error";

export default function AthleteHistoryError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Athlete history" error={error} retry={() => (retry ?? reset)?.()} />;
}
