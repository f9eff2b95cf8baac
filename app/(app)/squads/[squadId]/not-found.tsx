import { RecordNotFound } from "@/components/record-not-found";

export default function SquadNotFound() {
  return <RecordNotFound what="Squad" back="/squads" backLabel="Back to the Roster" />;
}
