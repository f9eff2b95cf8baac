import { RecordNotFound } from "@/components/record-not-found";

export default function SessionNotFound() {
  return <RecordNotFound what="Session" back="/sessions" backLabel="Back to Sessions" />;
}
