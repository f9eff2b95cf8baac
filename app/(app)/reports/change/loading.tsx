import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="the Change report" rows={10} />;
}
