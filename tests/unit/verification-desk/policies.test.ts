import { describe, expect, it } from "vitest";
import { can } from "@/lib/auth/policies";
import { ROLES, type CurrentUser, type Role } from "@/lib/auth/roles";
import { NAV_ITEMS } from "@/lib/navigation";

const userAs = (role: Role): CurrentUser => ({
  id: 1,
  email: `${role}@desk.example`,
  name: "T",
  role,
  organisationId: null,
});

// From the product brief's table of roles: verifiers load events and propose recalibrations,
// forecasters and duty officers read the scores, admins manage model versions.
const ALLOWED = {
  manageVerification: ["verifier"],
  readVerification: ["verifier", "forecaster", "duty_officer", "admin"],
  proposeCalibration: ["verifier"],
  activateCalibration: ["admin"],
} as const;

describe("verification policies", () => {
  it.each(Object.entries(ALLOWED))("%s allows exactly its roles", (policy, roles) => {
    for (const role of ROLES)
      expect(can(userAs(role), policy as keyof typeof ALLOWED)).toBe(
        (roles as readonly Role[]).includes(role),
      );
    expect(can(null, policy as keyof typeof ALLOWED)).toBe(false);
  });
  it("never lets the same role propose and activate", () => {
    for (const role of ROLES)
      expect(
        can(userAs(role), "proposeCalibration") && can(userAs(role), "activateCalibration"),
      ).toBe(false);
  });
});

describe("verification navigation", () => {
  it("lists the four pages in the Verification group, none for subscribers", () => {
    const items = NAV_ITEMS.filter((i) => i.group === "Verification");
    expect(items.map((i) => [i.label, i.href])).toEqual([
      ["Scores", "/verification"],
      ["Observed events", "/verification/events"],
      ["External forecasts", "/verification/external"],
      ["Recalibration", "/verification/recalibration"],
    ]);
    for (const item of items) expect(item.roles).not.toContain("subscriber");
  });
});
