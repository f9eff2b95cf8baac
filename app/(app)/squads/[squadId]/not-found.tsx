import { RecordNotFound } from "@/components/record-not-found";

export default function SquadNotFound() {
  return <RecordNotFound what="Squad" back="/" backLabel="Back to Squads" />;
}
