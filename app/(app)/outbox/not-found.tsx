import { RecordNotFound } from "@/components/record-not-found";

/** Anyone but the owner meets this: the page exists for owners only. */
export default function OutboxNotFound() {
  return <RecordNotFound what="Outbox" back="/" backLabel="Back to Squads" />;
}
