import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SessionSheet } from "@/components/sheet/session-sheet";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";

export const metadata: Metadata = { title: "Session sheet" };

export default async function SessionSheetPage({ params }: { params: Promise<{ sessionId: string }> }) {
  const { sessionId } = await params;
  const id = Number(sessionId);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  await pageGuard({ roles: STAFF, sessionId: id });
  return <SessionSheet sessionId={id} />;
}
