import { AppShell } from "@/components/app-shell";
import { Providers } from "@/components/providers";
import { pageGuard } from "@/lib/auth/page-guard";

export const dynamic = "force-dynamic";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const actor = await pageGuard();
  return (
    <Providers>
      <AppShell actor={actor}>{children}</AppShell>
    </Providers>
  );
}
