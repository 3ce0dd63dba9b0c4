// The measurements of one active region that guidance models score, as entered for day D.

/** Flares from the region in the 24 h before the assessment, counted by GOES class. */
export interface FlareCounts {
  C: number;
  M: number;
  X: number;
}

export interface AssessmentInput {
  /** Office region number, e.g. HR-0412. */
  region: string;
  /** Heliographic location as entered, e.g. N12E34. */
  location: string;
  areaMsh: number | null;
  spotCount: number | null;
  /** McIntosh Zpc class as entered; validated by the models that use it. */
  mcintosh: string | null;
  mountWilson: string | null;
  unsignedFluxMx?: number | null;
  pilLengthMm?: number | null;
  logR?: number | null;
  meanShearDeg?: number | null;
  freeEnergyProxy?: number | null;
  flares24h: FlareCounts;
}

/** Numeric inputs a statistical model may use as predictors. */
export const PREDICTOR_INPUTS = [
  "unsignedFluxMx",
  "pilLengthMm",
  "logR",
  "meanShearDeg",
  "freeEnergyProxy",
  "areaMsh",
  "spotCount",
  "deltaIndicator",
] as const;

export type PredictorInput = (typeof PREDICTOR_INPUTS)[number];

/** The magnetic metrics, whose values suffer projection effects near the limb. */
export const MAGNETIC_INPUTS: ReadonlySet<PredictorInput> = new Set<PredictorInput>([
  "unsignedFluxMx",
  "pilLengthMm",
  "logR",
  "meanShearDeg",
  "freeEnergyProxy",
]);
