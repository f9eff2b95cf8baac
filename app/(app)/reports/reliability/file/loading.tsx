import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="the Reliability check" rows={6} />;
}
