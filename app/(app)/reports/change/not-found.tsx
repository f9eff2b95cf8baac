import { RecordNotFound } from "@/components/record-not-found";

export default function ReportNotFound() {
  return <RecordNotFound what="Session or test" back="/reports/change" backLabel="Open the Change report afresh" />;
}
