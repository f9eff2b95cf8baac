import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Roster } from "@/components/squads/roster";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage({ params }: { params: Promise<{ squadId: string }> }) {
  const { squadId } = await params;
  const id = Number(squadId);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  // A coach reaching for another coach's squad gets the same answer as a squad that does not exist.
  await pageGuard({ roles: STAFF, squadId: id });
  return <Roster squadId={id} />;
}
