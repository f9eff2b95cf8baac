import Link from "next/link";
import type { Actor } from "@/lib/data/actors";
import { navFor, ROLE_LABELS } from "@/lib/nav";
import { NavLinks } from "./nav-links";
import { SignOutButton } from "./sign-out-button";

export function AppShell({ actor, children }: { actor: Actor; children: React.ReactNode }) {
  return (
    <div className="min-h-screen">
      <header className="on-dark bg-ink text-white print:hidden">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3 lg:gap-x-6">
          <Link href="/" className="text-lg font-bold tracking-tight">
            Changewise
          </Link>
          <nav aria-label="Main" className="flex-1">
            <NavLinks items={navFor(actor.role)} />
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <span className="text-white/80" title={`${ROLE_LABELS[actor.role]} · ${actor.organizationName}`}>
              <span className="font-semibold text-white">{actor.name}</span>
              {/* The role and the organisation would push the navigation onto two rows on smaller screens. */}
              <span className="hidden lg:inline"> · {ROLE_LABELS[actor.role]}</span>
              <span className="hidden 2xl:inline"> · {actor.organizationName}</span>
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6 print:max-w-none print:p-0">{children}</main>
    </div>
  );
}
