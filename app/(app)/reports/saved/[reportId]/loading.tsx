import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="the saved report" rows={10} />;
}
