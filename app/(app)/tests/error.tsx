"use client";

import { SegmentError } from "@/components/segment-error";

export default function TestLibraryError({
  error,
  retry,
  reset,
}: {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}) {
  return <SegmentError what="The Test library" error={error} retry={() => (retry ?? reset)?.()} />;
}
