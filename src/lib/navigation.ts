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
  { href: "/bulletins", label: "Bulletins", roles: ["forecaster", "verifier", "subscriber", "admin"], group: "Desk" },
  { href: "/bulletins/review", label: "Review queue", roles: ["duty_officer"], group: "Desk" },
  { href: "/verification", label: "Scores", roles: ["verifier", "forecaster", "duty_officer", "admin"], group: "Verification" },
  { href: "/verification/events", label: "Observed events", roles: ["verifier", "forecaster", "duty_officer", "admin"], group: "Verification" },
  { href: "/verification/external", label: "External forecasts", roles: ["verifier", "forecaster", "duty_officer", "admin"], group: "Verification" },
  { href: "/verification/recalibration", label: "Recalibration", roles: ["verifier", "admin"], group: "Verification" },
  { href: "/alerts", label: "Alerts", roles: ["duty_officer", "admin"], group: "Subscriptions" },
  { href: "/deliveries", label: "Deliveries", roles: ["duty_officer", "admin"], group: "Subscriptions" },
  { href: "/contacts", label: "Contacts", roles: ["duty_officer", "admin"], group: "Subscriptions" },
  { href: "/subscriptions", label: "My alerts and thresholds", roles: ["subscriber"], group: "Subscriptions" },
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

/** The one item to mark current: the longest href that matches, so /bulletins/review is not also /bulletins. */
export function currentHref(items: readonly NavItem[], pathname: string): string | null {
  const matches = items.filter((i) => isCurrentPath(i.href, pathname));
  return matches.sort((a, b) => b.href.length - a.href.length)[0]?.href ?? null;
}
