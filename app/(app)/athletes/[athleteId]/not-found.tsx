import { RecordNotFound } from "@/components/record-not-found";

export default function AthleteNotFound() {
  return <RecordNotFound what="Athlete" back="/" backLabel="Back to Squads" />;
}
