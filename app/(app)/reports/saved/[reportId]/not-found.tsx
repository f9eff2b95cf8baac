import { RecordNotFound } from "@/components/record-not-found";

export default function SavedReportNotFound() {
  return <RecordNotFound what="Saved report" back="/reports/change" backLabel="Back to the Change report" />;
}
