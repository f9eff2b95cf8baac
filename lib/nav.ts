import { PEOPLE_ROLES, RELIABILITY_ROLES, STAFF } from "@/lib/auth/permissions";
import type { Role } from "@/lib/domain";

export type NavItem = { href: string; label: string; roles: readonly Role[] };

/** Screens by role, with our own names (PRODUCT.md §6). Only screens that exist are listed. */
export const NAV_ITEMS: NavItem[] = [
  { href: "/", label: "Squads", roles: STAFF },
  { href: "/tests", label: "Test library", roles: STAFF },
  { href: "/sessions", label: "Sessions", roles: STAFF },
  { href: "/reports/change", label: "Change report", roles: STAFF },
  { href: "/reports/reliability", label: "Reliability check", roles: RELIABILITY_ROLES },
  { href: "/people", label: "People", roles: PEOPLE_ROLES },
  { href: "/outbox", label: "Outbox", roles: PEOPLE_ROLES },
  { href: "/", label: "My progress", roles: ["athlete"] },
];

export function navFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role));
}

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  scientist: "Sport scientist",
  coach: "Coach",
  athlete: "Athlete",
};
