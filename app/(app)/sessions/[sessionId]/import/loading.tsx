import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="Import" rows={4} />;
}
