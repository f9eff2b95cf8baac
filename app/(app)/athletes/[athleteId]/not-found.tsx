import { RecordNotFound } from "@/components/record-not-found";

export default function AthleteNotFound() {
  return <RecordNotFound what="Athlete" back="/squads" backLabel="Back to the squads" />;
}
