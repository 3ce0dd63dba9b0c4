// Role rules as pure functions. Islands may use them to hide controls; the guards module
// (src/server/auth/guards.ts) enforces them on every page and endpoint.
import type { CurrentUser, Role } from "./roles";

export type Policy = (user: CurrentUser) => boolean;

function anyOf(...roles: Role[]): Policy {
  return (user) => roles.includes(user.role);
}

export const policies = {
  /** Any signed-in user. */
  signedIn: (() => true) as Policy,
  manageUsers: anyOf("admin"),
  readAudit: anyOf("admin"),
  readMailbox: anyOf("admin"),
  manageSettings: anyOf("admin"),
  /** Enter and change region assessments and final probabilities. */
  editAssessments: anyOf("forecaster", "duty_officer"),
  /** Read assessments and guidance (verifiers and admins read, subscribers do not). */
  readAssessments: anyOf("forecaster", "duty_officer", "verifier", "admin"),
  manageModels: anyOf("admin"),
} satisfies Record<string, Policy>;

export type PolicyName = keyof typeof policies;

export function can(user: CurrentUser | null | undefined, policy: PolicyName): boolean {
  return !!user && policies[policy](user);
}
