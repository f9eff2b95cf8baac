import type { Metadata } from "next";
import { SessionList } from "@/components/sessions/session-list";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";

export const metadata: Metadata = { title: "Sessions" };

export default async function SessionsPage({ searchParams }: { searchParams: Promise<{ squadId?: string | string[] }> }) {
  const actor = await pageGuard({ roles: STAFF });
  const raw = (await searchParams).squadId;
  const squadId = Number(Array.isArray(raw) ? raw[0] : raw);
  return <SessionList role={actor.role} initialSquadId={Number.isSafeInteger(squadId) && squadId > 0 ? squadId : null} />;
}
