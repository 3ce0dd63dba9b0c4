import { describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/lib/auth/roles";
import { isCurrentPath, NAV_ITEMS, navigationFor } from "@/lib/navigation";

// The foundation's administration pages; other sections add their own items beside these.
const ADMIN_ITEMS = [
  { href: "/admin/users", label: "People" },
  { href: "/admin/organisations", label: "Organisations" },
  { href: "/admin/settings", label: "Office settings" },
  { href: "/admin/audit", label: "Audit trail" },
  { href: "/admin/mailbox", label: "Mailbox (local)" },
];

const itemsFor = (role: Role) => navigationFor(role).flatMap((g) => g.items);

describe("navigation per role", () => {
  it("shows the administrator the overview first and every administration page", () => {
    const items = itemsFor("admin");
    expect(items[0]).toMatchObject({ href: "/", label: "Overview" });
    for (const item of ADMIN_ITEMS) expect(items).toContainEqual(expect.objectContaining(item));
    const admin = navigationFor("admin").find((g) => g.group === "Administration");
    expect(admin?.items.map((i) => i.label)).toEqual(
      expect.arrayContaining(ADMIN_ITEMS.map((i) => i.label)),
    );
  });

  it.each(ROLES.filter((r) => r !== "admin"))(
    "shows %s the overview and no administration page",
    (role) => {
      const items = itemsFor(role);
      expect(items[0]).toMatchObject({ href: "/", label: "Overview" });
      expect(items.filter((i) => i.href.startsWith("/admin"))).toEqual([]);
      expect(navigationFor(role).map((g) => g.group)).not.toContain("Administration");
    },
  );

  it("gives every role exactly the items that list it, each once", () => {
    for (const role of ROLES) {
      const expected = NAV_ITEMS.filter((i) => i.roles.includes(role))
        .map((i) => i.href)
        .sort();
      expect(
        itemsFor(role)
          .map((i) => i.href)
          .sort(),
      ).toEqual(expected);
    }
  });

  it("keeps every /admin item for administrators only", () => {
    const adminOnly = NAV_ITEMS.filter((i) => i.href.startsWith("/admin"));
    expect(adminOnly.length).toBeGreaterThanOrEqual(ADMIN_ITEMS.length);
    for (const item of adminOnly) expect(item.roles).toEqual(["admin"]);
  });
});

describe("isCurrentPath", () => {
  it("marks the overview only on the root", () => {
    expect(isCurrentPath("/", "/")).toBe(true);
    expect(isCurrentPath("/", "/admin/users")).toBe(false);
  });

  it("marks a section on its own page and pages below it, not on look-alike prefixes", () => {
    expect(isCurrentPath("/admin/users", "/admin/users")).toBe(true);
    expect(isCurrentPath("/admin/users", "/admin/users/12")).toBe(true);
    expect(isCurrentPath("/admin/users", "/admin/users-archive")).toBe(false);
    expect(isCurrentPath("/admin/users", "/admin")).toBe(false);
  });
});

describe("currentHref", () => {
  it("marks the longest matching item only (common practice for nested navigation)", async () => {
    const { currentHref } = await import("@/lib/navigation");
    const items = [
      { href: "/", label: "Overview", roles: ["admin"], group: "Desk" },
      { href: "/verification", label: "Scores", roles: ["admin"], group: "Verification" },
      { href: "/verification/events", label: "Observed events", roles: ["admin"], group: "Verification" },
    ] as const;
    expect(currentHref(items, "/verification/events")).toBe("/verification/events");
    expect(currentHref(items, "/verification/report")).toBe("/verification");
    expect(currentHref(items, "/")).toBe("/");
    expect(currentHref(items, "/nowhere")).toBeNull();
  });
});
