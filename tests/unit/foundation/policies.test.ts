import { describe, expect, it } from "vitest";
import { can, policies, type PolicyName } from "@/lib/auth/policies";
import { ROLES, type CurrentUser, type Role } from "@/lib/auth/roles";

const userAs = (role: Role): CurrentUser => ({
  id: 1,
  email: `${role}@desk.example`,
  name: "Test Person",
  role,
  organisationId: role === "subscriber" ? 3 : null,
});

// Who does what, from the product brief's table of roles (DESIGN.md "Who uses it and for what"):
// forecasters draft, duty officers review, issue and watch alerts, verifiers score and propose
// coefficients, subscribers receive and acknowledge, admins administer people and models.
const STAFF: Role[] = ["forecaster", "duty_officer", "verifier", "admin"];
const ALLOWED: Record<PolicyName, readonly Role[]> = {
  signedIn: [...ROLES],
  manageUsers: ["admin"],
  readAudit: ["admin"],
  readMailbox: ["admin"],
  manageSettings: ["admin"],
  editAssessments: ["forecaster", "duty_officer"],
  readAssessments: STAFF,
  manageModels: ["admin"],
  draftBulletins: ["forecaster", "duty_officer"],
  reviewBulletins: ["duty_officer"],
  readBulletins: [...ROLES],
  readDraftBulletins: STAFF,
  manageVerification: ["verifier"],
  readVerification: STAFF,
  proposeCalibration: ["verifier"],
  activateCalibration: ["admin"],
  manageContacts: ["duty_officer", "admin"],
  watchDeliveries: ["duty_officer", "admin"],
  watchAlerts: ["duty_officer", "admin"],
  manageOwnSubscription: ["subscriber"],
};

const cases = (Object.keys(ALLOWED) as PolicyName[]).flatMap((policy) =>
  ROLES.map((role) => ({ policy, role, isAllowed: ALLOWED[policy].includes(role) })),
);

describe("role policies", () => {
  it("has an expectation for every policy the module defines, and no others", () => {
    expect(Object.keys(policies).sort()).toEqual(Object.keys(ALLOWED).sort());
  });

  it.each(cases)("$policy for $role is $isAllowed", ({ policy, role, isAllowed }) => {
    expect(can(userAs(role), policy)).toBe(isAllowed);
  });

  it("allows nothing to a signed-out visitor", () => {
    for (const policy of Object.keys(ALLOWED) as PolicyName[]) {
      expect(can(null, policy)).toBe(false);
      expect(can(undefined, policy)).toBe(false);
    }
  });

  it("decides by role alone, not by e-mail or organisation", () => {
    const lookalike = { ...userAs("forecaster"), email: "admin@desk.example", organisationId: 1 };
    expect(can(lookalike, "manageUsers")).toBe(false);
    expect(can({ ...userAs("admin"), email: "x@y.example" }, "manageUsers")).toBe(true);
  });
});
