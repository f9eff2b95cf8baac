import { RecordNotFound } from "@/components/record-not-found";

export default function ReliabilityNotFound() {
  return (
    <RecordNotFound what="Session or test" back="/reports/reliability" backLabel="Open the Reliability check afresh" />
  );
}
