// The event form's values: defaults for a new event or a correction, and the request body each sends.
import type { EventView } from "@/lib/query/verification";

export interface EventFormValues {
  start: string;
  peak: string;
  end: string;
  goesClass: string;
  regionNumber: string;
  convention: string;
  reason: string;
}

/** Times shown to the minute with the Z suffix, as the form accepts them back. */
const toMinute = (iso: string) => `${iso.slice(0, 16)}Z`;

export function toFormDefaults(event: EventView | null): EventFormValues {
  if (!event)
    return {
      start: "",
      peak: "",
      end: "",
      goesClass: "",
      regionNumber: "",
      convention: "true",
      reason: "",
    };
  return {
    start: toMinute(event.startTime),
    peak: toMinute(event.peakTime),
    end: toMinute(event.endTime),
    goesClass: event.originalClass,
    regionNumber: event.regionNumber ?? "",
    convention: event.convention,
    reason: "",
  };
}

/** A correction sends its reason and keeps the list's convention; a new event sends the convention. */
export function toRequestBody(v: EventFormValues, isCorrection: boolean): Record<string, string> {
  const common = {
    start: v.start,
    peak: v.peak,
    end: v.end,
    goesClass: v.goesClass,
    regionNumber: v.regionNumber,
  };
  return isCorrection ? { ...common, reason: v.reason } : { ...common, convention: v.convention };
}
