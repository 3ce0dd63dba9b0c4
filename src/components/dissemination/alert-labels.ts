// Words and chip colours for alert states on the board and in the portal (isomorphic).
import type { AlertState } from "@/lib/schemas/subscriptions";

export const STATE_LABELS: Record<AlertState, string> = {
  open: "Not acknowledged",
  reminded: "Reminder sent",
  escalated: "Escalated to duty officers",
  acknowledged: "Acknowledged",
  expired: "Window ended unacknowledged",
};

export const STATE_CHIPS: Record<AlertState, string> = {
  open: "border-gold-600/50 text-gold-600",
  reminded: "border-gold-600/50 bg-gold-100 text-gold-600",
  escalated: "border-warn-700/50 bg-warn-100 text-warn-700",
  acknowledged: "border-calm-600/50 bg-calm-100 text-calm-600",
  expired: "border-ink-700/30 text-ink-700",
};

export const VIA_LABELS: Record<string, string> = {
  link: "e-mail link",
  portal: "subscriber portal",
  desk: "recorded by the desk",
};

/** "42 min" or "3 h 05 min" since `from`. */
export function describeAge(from: string, now: Date): string {
  const minutes = Math.max(0, Math.floor((now.getTime() - new Date(from).getTime()) / 60_000));
  return minutes < 60
    ? `${minutes} min`
    : `${Math.floor(minutes / 60)} h ${String(minutes % 60).padStart(2, "0")} min`;
}
