// The five roles of the desk and how they are shown (isomorphic).
export const ROLES = ["forecaster", "duty_officer", "verifier", "subscriber", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  forecaster: "Forecaster",
  duty_officer: "Duty officer",
  verifier: "Verifier",
  subscriber: "Subscriber",
  admin: "Administrator",
};

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

export interface CurrentUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  organisationId: number | null;
}
