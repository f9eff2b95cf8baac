import "server-only";
import { notFound, redirect } from "next/navigation";
import { ApiError } from "@/lib/errors";
import { canonicalId } from "@/lib/ids";
import { type GuardOptions, guard } from "./guard";

/**
 * The guard for server components: signed-out visitors go to sign-in, and anything
 * outside the caller's role or reach is simply not found.
 */
export async function pageGuard(options: GuardOptions = {}) {
  try {
    return await guard(options);
  } catch (error) {
    if (error instanceof ApiError) {
      if (error.status === 401) redirect("/sign-in");
      notFound();
    }
    throw error;
  }
}

/** A record id from the URL; anything but a canonical positive integer is simply not found. */
export function pageId(segment: string): number {
  const id = canonicalId(segment);
  if (id === null) notFound();
  return id;
}
