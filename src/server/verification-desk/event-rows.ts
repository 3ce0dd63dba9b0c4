// Validates the rows of an uploaded flare event list, normalises peak flux to the true-flux
// convention and marks duplicates within the file and against stored events (pure).
import { parseUtcTimestamp, type FluxConventionName } from "@/lib/schemas/verification";
import { REGION_NUMBER_PATTERN } from "@/lib/schemas/assessment";
import { parseGoesClass, toTrueFlux } from "@/server/verification/goes";
import type { HeaderAliases, TextRow } from "./table-file";

export const EVENT_FIELDS = ["start", "peak", "end", "goesClass", "region"] as const;
export type EventField = (typeof EVENT_FIELDS)[number];
export const REQUIRED_EVENT_FIELDS: readonly EventField[] = ["start", "peak", "end", "goesClass"];

export const EVENT_ALIASES: HeaderAliases<EventField> = {
  start: ["start", "begin", "starttime", "begintime", "startutc"],
  peak: ["peak", "max", "maximum", "peaktime", "maxtime", "peakutc"],
  end: ["end", "stop", "endtime", "stoptime", "endutc"],
  goesClass: ["class", "goesclass", "xrayclass", "xray", "flareclass"],
  region: ["region", "regionnumber", "regionno", "ar", "activeregion"],
};

export interface ValidEvent {
  startTime: Date;
  peakTime: Date;
  endTime: Date;
  /** The class as the list gave it (upper case), in the list's convention. */
  originalClass: string;
  peakFluxTrue: number;
  regionNumber: string | null;
}

export interface EventRowCheck {
  /** 1 = the first data row. */
  row: number;
  values: TextRow<EventField>;
  errors: Partial<Record<EventField | "row", string>>;
  isDuplicate: boolean;
  event: ValidEvent | null;
}

/**
 * True flux rounded to 10 significant digits: a class carries two or three, so this keeps every
 * published digit while making "legacy C7.0" and "true M1.0" the same stored number, which the
 * (peak time, true flux) de-duplication key needs (0.7e-5 / 0.7 is not exactly 1e-5 in binary).
 */
export function normaliseTrueFlux(flux: number): number {
  return Number(flux.toPrecision(10));
}

export function eventKey(peakTimeMs: number, peakFluxTrue: number): string {
  return `${peakTimeMs}|${peakFluxTrue}`;
}

type Checked = { event: ValidEvent | null; errors: EventRowCheck["errors"] };

/** One event from its text fields, or the errors that stop it. */
export function checkEventValues(v: TextRow<EventField>, convention: FluxConventionName): Checked {
  const errors: EventRowCheck["errors"] = {};
  const times = (["start", "peak", "end"] as const).map((f) => {
    const text = v[f] ?? "";
    if (text === "") {
      errors[f] = `The ${f} time is missing.`;
      return null;
    }
    const parsed = parseUtcTimestamp(text);
    if (!parsed.ok) errors[f] = parsed.message;
    return parsed.ok ? parsed.ms : null;
  });
  const [start, peak, end] = times;
  if (start != null && peak != null && peak < start) errors.peak = "The peak is before the start.";
  if (peak != null && end != null && end < peak) errors.end = "The end is before the peak.";
  const cls = parseGoesClass(v.goesClass ?? "");
  if (!cls.ok) errors.goesClass = cls.message;
  const region = (v.region ?? "").trim().toUpperCase();
  if (region !== "" && !REGION_NUMBER_PATTERN.test(region))
    errors.region = `"${v.region}" is not a region number like HR-0412.`;
  if (Object.keys(errors).length > 0 || !cls.ok || start == null || peak == null || end == null)
    return { event: null, errors };
  return {
    errors,
    event: {
      startTime: new Date(start),
      peakTime: new Date(peak),
      endTime: new Date(end),
      originalClass: (v.goesClass ?? "").trim().toUpperCase(),
      peakFluxTrue: normaliseTrueFlux(toTrueFlux(cls.fluxWm2, convention)),
      regionNumber: region === "" ? null : region,
    },
  };
}

/**
 * Checks every row. A row whose peak time and true flux match an earlier row, or a stored event
 * (`storedKeys`, from eventKey), is a duplicate: it says which and stores nothing by itself.
 */
export function checkEventRows(
  rows: readonly TextRow<EventField>[],
  convention: FluxConventionName,
  storedKeys: ReadonlySet<string>,
): EventRowCheck[] {
  const firstRowOf = new Map<string, number>();
  return rows.map((values, i) => {
    const row = i + 1;
    const { event, errors } = checkEventValues(values, convention);
    let isDuplicate = false;
    if (event) {
      const key = eventKey(event.peakTime.getTime(), event.peakFluxTrue);
      const earlier = firstRowOf.get(key);
      if (earlier !== undefined) {
        isDuplicate = true;
        errors.row = `Duplicate of row ${earlier} (same peak time and peak flux).`;
      } else if (storedKeys.has(key)) {
        isDuplicate = true;
        errors.row = "Already stored: an event with the same peak time and peak flux exists.";
      }
      if (earlier === undefined) firstRowOf.set(key, row);
    }
    return { row, values, errors, isDuplicate, event };
  });
}
