import type { Metadata } from "next";
import { AthleteHome } from "@/components/athlete-home";
import { SquadsOverview } from "@/components/squads-overview";
import { pageGuard } from "@/lib/auth/page-guard";
import { isAthlete } from "@/lib/auth/permissions";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const actor = await pageGuard();
  if (isAthlete(actor)) return <AthleteHome athleteId={actor.athleteId} name={actor.name} />;
  return <SquadsOverview role={actor.role} />;
}
