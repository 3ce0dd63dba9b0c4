// Validity windows of a bulletin: 24, 48 and 72 h, each starting at the issue time (UTC).
import { WINDOW_HOURS, WINDOW_KEYS, type WindowKey } from "@/lib/domain/flare-levels";

export interface ValidityWindow {
  window: WindowKey;
  hours: number;
  startsAt: Date;
  endsAt: Date;
}

const HOUR_MS = 3_600_000;

export function validityWindows(issueTime: Date): ValidityWindow[] {
  return WINDOW_KEYS.map((window) => ({
    window,
    hours: WINDOW_HOURS[window],
    startsAt: new Date(issueTime.getTime()),
    endsAt: new Date(issueTime.getTime() + WINDOW_HOURS[window] * HOUR_MS),
  }));
}

/** "2031-05-06 00:30 – 2031-05-07 00:30 UTC". */
export function formatValidityRange(w: Pick<ValidityWindow, "startsAt" | "endsAt">): string {
  const at = (d: Date) => d.toISOString().slice(0, 16).replace("T", " ");
  return `${at(w.startsAt)} – ${at(w.endsAt)} UTC`;
}
