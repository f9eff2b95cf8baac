import type { Metadata } from "next";
import { SquadList } from "@/components/squads/squad-list";
import { STAFF } from "@/lib/auth/guard";
import { pageGuard } from "@/lib/auth/page-guard";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterIndexPage() {
  const actor = await pageGuard({ roles: STAFF });
  return <SquadList role={actor.role} />;
}
