// Owns the acknowledgement state an alert is in at a given moment (pure).
import type { AlertState } from "@/lib/schemas/subscriptions";

export interface AlertTimes {
  acknowledgedAt: Date | null;
  remindedAt: Date | null;
  escalatedAt: Date | null;
  windowEndsAt: Date | null;
}

/** Acknowledged wins; an unacknowledged alert whose window has ended has expired. */
export function alertStateAt(alert: AlertTimes, now: Date): AlertState {
  if (alert.acknowledgedAt) return "acknowledged";
  if (alert.windowEndsAt && alert.windowEndsAt.getTime() <= now.getTime()) return "expired";
  if (alert.escalatedAt) return "escalated";
  if (alert.remindedAt) return "reminded";
  return "open";
}

/** States the desk still has to chase. */
export function isChaseable(state: AlertState): boolean {
  return state === "open" || state === "reminded" || state === "escalated";
}
