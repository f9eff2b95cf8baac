import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="People" rows={8} />;
}
