"use client";

import { SegmentError } from "@/components/segment-error";

export default function SquadRosterError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Roster" error={error} retry={() => (retry ?? reset)?.()} />;
}
