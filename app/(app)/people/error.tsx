"use client";

import { SegmentError } from "@/components/segment-error";

export default function PeopleError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="People" error={error} retry={() => (retry ?? reset)?.()} />;
}
