import { RecordNotFound } from "@/components/record-not-found";

export default function ReliabilityFileNotFound() {
  return <RecordNotFound what="Test" back="/reports/reliability/file" backLabel="Open the file check afresh" />;
}
