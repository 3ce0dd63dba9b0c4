// Turns a stored assessment into the editor's starting values (isomorphic).
export interface StoredAssessmentLike {
  region: string;
  location: string;
  areaMsh: number | null;
  spotCount: number | null;
  mcintosh: string | null;
  mountWilson: string | null;
  unsignedFluxMx: number | null;
  pilLengthMm: number | null;
  logR: number | null;
  meanShearDeg: number | null;
  freeEnergyProxy: number | null;
  flares24h: { C: number; M: number; X: number };
  notes: string;
}

const text = (v: number | null) => (v === null ? "" : String(v));

export function toEditorValues(a: StoredAssessmentLike, options: { keepNotes: boolean }) {
  return {
    region: a.region,
    location: a.location,
    areaMsh: text(a.areaMsh),
    spotCount: text(a.spotCount),
    mcintosh: a.mcintosh ?? "",
    mountWilson: a.mountWilson ?? "",
    unsignedFluxMx: text(a.unsignedFluxMx),
    pilLengthMm: text(a.pilLengthMm),
    logR: text(a.logR),
    meanShearDeg: text(a.meanShearDeg),
    freeEnergyProxy: text(a.freeEnergyProxy),
    flares24h: { C: String(a.flares24h.C), M: String(a.flares24h.M), X: String(a.flares24h.X) },
    notes: options.keepNotes ? a.notes : "",
  };
}

export const EMPTY_EDITOR_VALUES = {
  region: "",
  location: "",
  areaMsh: "",
  spotCount: "",
  mcintosh: "",
  mountWilson: "",
  unsignedFluxMx: "",
  pilLengthMm: "",
  logR: "",
  meanShearDeg: "",
  freeEnergyProxy: "",
  flares24h: { C: "0", M: "0", X: "0" },
  notes: "",
};

export function todayUtc(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}
