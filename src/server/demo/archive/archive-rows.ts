// Maps a generated demo archive onto the rows of the database tables (no queries here).

import { assessments, flareEvents, forecastRecords, guidance } from "@/db/schema";
import type { DemoArchive } from "./archive-types";
import type { CopyValue } from "./copy-rows";
import type { ArchiveForecastRecord } from "./day-forecasts";

export const DEMO_ARCHIVE_NOTE = "Demo archive — invented for the scenario.";

/** Drafts are written 20 minutes and guidance 25 minutes before the 00:30 UTC issue (invented). */
const subtractMinutes = (iso: string, minutes: number) =>
  new Date(Date.parse(iso) - minutes * 60_000);

/** Columns of the assessment COPY, in the order `toAssessmentValues` writes them. */
export const ASSESSMENT_COPY_COLUMNS = [
  assessments.regionId,
  assessments.forecastDay,
  assessments.location,
  assessments.latitudeDeg,
  assessments.longitudeDeg,
  assessments.isLimbFlagged,
  assessments.areaMsh,
  assessments.spotCount,
  assessments.mcintosh,
  assessments.mountWilson,
  assessments.unsignedFluxMx,
  assessments.pilLengthMm,
  assessments.logR,
  assessments.meanShearDeg,
  assessments.freeEnergyProxy,
  assessments.flaresC,
  assessments.flaresM,
  assessments.flaresX,
  assessments.notes,
  assessments.blended,
  assessments.finals,
  assessments.finalReasons,
  assessments.isDemo,
  assessments.createdBy,
  assessments.updatedBy,
  assessments.createdAt,
  assessments.updatedAt,
];

export function toAssessmentValues(
  archive: DemoArchive,
  regionIds: ReadonlyMap<string, number>,
  pickForecaster: (day: string) => number,
): CopyValue[][] {
  return archive.regionDays.map((r) => {
    const regionId = regionIds.get(r.regionNumber);
    if (regionId === undefined) throw new Error(`No region id for ${r.regionNumber}`);
    const userId = pickForecaster(r.day);
    const at = subtractMinutes(r.issueTime, 20);
    const i = r.input;
    const { C, M, X } = i.flares24h;
    return [
      regionId,
      r.day,
      i.location,
      r.latitudeDeg,
      r.longitudeDeg,
      r.isLimbFlagged,
      i.areaMsh,
      i.spotCount,
      i.mcintosh,
      i.mountWilson,
      i.unsignedFluxMx ?? null,
      i.pilLengthMm ?? null,
      i.logR ?? null,
      i.meanShearDeg ?? null,
      i.freeEnergyProxy ?? null,
      C,
      M,
      X,
      DEMO_ARCHIVE_NOTE,
      r.blended,
      r.finals,
      r.finalReasons,
      true,
      userId,
      userId,
      at,
      at,
    ];
  });
}

/** Key of an assessment in the maps below: region number and forecast day. */
export function formatRegionDayKey(regionNumber: string, day: string): string {
  return `${regionNumber.toUpperCase()}|${day}`;
}

/** Columns of the guidance COPY, in the order `toGuidanceValues` writes them. */
export const GUIDANCE_COPY_COLUMNS = [
  guidance.assessmentId,
  guidance.modelId,
  guidance.modelKey,
  guidance.modelVersion,
  guidance.inputs,
  guidance.probabilities,
  guidance.flags,
  guidance.missingInputs,
  guidance.computedAt,
];

export function toGuidanceValues(
  archive: DemoArchive,
  assessmentIds: ReadonlyMap<string, number>,
  modelIds: ReadonlyMap<string, number>,
): CopyValue[][] {
  return archive.regionDays.flatMap((r) => {
    const assessmentId = assessmentIds.get(formatRegionDayKey(r.regionNumber, r.day));
    if (assessmentId === undefined)
      throw new Error(`No assessment id for ${r.regionNumber} on ${r.day}`);
    const computedAt = subtractMinutes(r.issueTime, 25);
    return r.guidance.map((g) => {
      const modelId = modelIds.get(`${g.key}@${g.version}`);
      if (modelId === undefined) throw new Error(`Model ${g.key} ${g.version} is not registered`);
      return [
        assessmentId,
        modelId,
        g.key,
        g.version,
        r.input,
        g.probabilities,
        g.flags,
        g.missingInputs,
        computedAt,
      ];
    });
  });
}

/** Columns of the flare-event COPY, in the order `toFlareEventValues` writes them. */
export const FLARE_EVENT_COPY_COLUMNS = [
  flareEvents.listId,
  flareEvents.startTime,
  flareEvents.peakTime,
  flareEvents.endTime,
  flareEvents.originalClass,
  flareEvents.peakFluxTrue,
  flareEvents.regionNumber,
  flareEvents.isDemo,
];

export function toFlareEventValues(archive: DemoArchive, listId: number): CopyValue[][] {
  return archive.flares.map((f) => [
    listId,
    f.startTime,
    f.peakTime,
    f.endTime,
    f.originalClass,
    f.peakFluxTrue,
    f.regionNumber,
    true,
  ]);
}

/** Columns of the forecast-record COPY, in the order `toForecastRecordValues` writes them. */
export const FORECAST_RECORD_COPY_COLUMNS = [
  forecastRecords.source,
  forecastRecords.issueTime,
  forecastRecords.regionNumber,
  forecastRecords.level,
  forecastRecords.windowHours,
  forecastRecords.probability,
  forecastRecords.isDemo,
];

export function toForecastRecordValues(records: readonly ArchiveForecastRecord[]): CopyValue[][] {
  return records.map((r) => [
    r.source,
    r.issueTime,
    r.regionNumber,
    r.level,
    r.windowHours,
    r.probability,
    true,
  ]);
}
