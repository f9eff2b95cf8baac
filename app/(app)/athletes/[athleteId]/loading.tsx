import { TableLoading } from "@/components/table-loading";

export default function Loading() {
  return <TableLoading label="the Athlete history" rows={8} />;
}
