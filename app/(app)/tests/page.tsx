import type { Metadata } from "next";
import { TestLibrary } from "@/components/tests/test-library";
import { STAFF } from "@/lib/auth/guard";
import { canEditTestLibrary } from "@/lib/auth/permissions";
import { pageGuard } from "@/lib/auth/page-guard";

export const metadata: Metadata = { title: "Test library" };

export default async function TestLibraryPage() {
  const actor = await pageGuard({ roles: STAFF });
  return <TestLibrary canEdit={canEditTestLibrary(actor)} />;
}
