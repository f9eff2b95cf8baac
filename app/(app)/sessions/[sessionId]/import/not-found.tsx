import { RecordNotFound } from "@/components/record-not-found";

export default function ImportSessionNotFound() {
  return <RecordNotFound what="Session" back="/sessions" backLabel="Back to Sessions" />;
}
