// What each role sees in the navigation: its own work first (isomorphic, used by the shell).
import type { Role } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  roles: readonly Role[];
  group: "Desk" | "Forecast" | "Verification" | "Subscriptions" | "Administration";
}

export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/", label: "Overview", roles: ["forecaster", "duty_officer", "verifier", "subscriber", "admin"], group: "Desk" },
  { href: "/days", label: "Forecast days", roles: ["forecaster", "duty_officer", "verifier", "admin"], group: "Forecast" },
  { href: "/regions", label: "Regions", roles: ["forecaster", "duty_officer", "verifier", "admin"], group: "Forecast" },
  { href: "/admin/users", label: "People", roles: ["admin"], group: "Administration" },
  { href: "/admin/organisations", label: "Organisations", roles: ["admin"], group: "Administration" },
  { href: "/admin/models", label: "Guidance models", roles: ["admin"], group: "Administration" },
  { href: "/admin/settings", label: "Office settings", roles: ["admin"], group: "Administration" },
  { href: "/admin/audit", label: "Audit trail", roles: ["admin"], group: "Administration" },
  { href: "/admin/mailbox", label: "Mailbox (local)", roles: ["admin"], group: "Administration" },
];

export function navigationFor(role: Role): { group: NavItem["group"]; items: NavItem[] }[] {
  const groups = new Map<NavItem["group"], NavItem[]>();
  for (const item of NAV_ITEMS) {
    if (!item.roles.includes(role)) continue;
    groups.set(item.group, [...(groups.get(item.group) ?? []), item]);
  }
  return [...groups.entries()].map(([group, items]) => ({ group, items }));
}

export function isCurrentPath(href: string, pathname: string): boolean {
  return href === "/" ? pathname === "/" : pathname === href || pathname.startsWith(`${href}/`);
}
