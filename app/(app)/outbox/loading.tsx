import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="Outbox" rows={8} />;
}
