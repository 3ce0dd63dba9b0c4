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
  /** Start bulletins and corrections, edit the discussion, submit for review. */
  draftBulletins: anyOf("forecaster", "duty_officer"),
  /** Return, approve and issue, withdraw (never one's own: the state machine refuses that). */
  reviewBulletins: anyOf("duty_officer"),
  /** Read bulletins: subscribers see issued, superseded and withdrawn ones only. */
  readBulletins: anyOf("forecaster", "duty_officer", "verifier", "subscriber", "admin"),
  /** Read bulletins that are not issued yet (draft, in review, returned). */
  readDraftBulletins: anyOf("forecaster", "duty_officer", "verifier", "admin"),
  /** Upload and correct observed events, upload external series, run the report's exports. */
  manageVerification: anyOf("verifier"),
  /** Read verification scores, events and proposals (forecasters and duty officers read only). */
  readVerification: anyOf("verifier", "forecaster", "duty_officer", "admin"),
  /** Fit recalibrated coefficients on the archive and propose them. */
  proposeCalibration: anyOf("verifier"),
  /** Turn a proposal into a new, active model version. */
  activateCalibration: anyOf("admin"),
  /** Manage subscriber contacts, their thresholds and CSV imports. */
  manageContacts: anyOf("duty_officer", "admin"),
  /** Watch delivery progress and retry failed deliveries. */
  watchDeliveries: anyOf("duty_officer", "admin"),
  /** Watch alerts and acknowledgements, chase contacts, record an acknowledgement taken by phone. */
  watchAlerts: anyOf("duty_officer", "admin"),
  /** A subscriber's own bulletin choice, thresholds and open alerts (never another contact's). */
  manageOwnSubscription: anyOf("subscriber"),
} satisfies Record<string, Policy>;

export type PolicyName = keyof typeof policies;

export function can(user: CurrentUser | null | undefined, policy: PolicyName): boolean {
  return !!user && policies[policy](user);
}
