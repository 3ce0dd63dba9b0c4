// Hard limits and plausibility ranges of the region measurements entered with an assessment.
// Hard limits are errors (the value cannot be right); plausibility ranges only raise warnings.

export const METRIC_FIELDS = [
  "unsignedFluxMx",
  "pilLengthMm",
  "logR",
  "meanShearDeg",
  "freeEnergyProxy",
  "areaMsh",
  "spotCount",
] as const;

export type MetricField = (typeof METRIC_FIELDS)[number];
export type MetricInput = Partial<Record<MetricField, number | null | undefined>>;

export interface MetricIssue {
  field: MetricField;
  message: string;
}

interface MetricRange {
  label: string;
  unit: string;
  hardMin?: number;
  hardMax?: number;
  isInteger?: boolean;
  /** Outside [warnBelow, warnAbove] the value is far from what regions usually show. */
  warnBelow?: number;
  warnAbove?: number;
  why?: string;
}

// Typical ranges: flux 1e20–1e23 Mx and log R 0–6 (Schrijver 2007, ApJ 655, L117; Bobra et al.
// 2014, Solar Phys. 289, 3549). Warnings fire an order of magnitude beyond the flux range; the PIL,
// area and spot-count bounds are this product's choice, set from memory of large groups (the
// largest recorded groups reach about 6000 MSH).
export const METRIC_RANGES: Readonly<Record<MetricField, MetricRange>> = {
  unsignedFluxMx: {
    label: "Total unsigned flux",
    unit: "Mx",
    hardMin: 0,
    warnBelow: 1e19,
    warnAbove: 1e24,
    why: "regions usually carry 1e20–1e23 Mx",
  },
  pilLengthMm: {
    label: "PIL length",
    unit: "Mm",
    hardMin: 0,
    warnAbove: 500,
    why: "polarity-inversion lines rarely exceed a few hundred Mm",
  },
  logR: {
    label: "log R",
    unit: "log10 Mx",
    warnBelow: 0,
    warnAbove: 6,
    why: "log R usually lies between 0 and 6",
  },
  meanShearDeg: { label: "Mean shear angle", unit: "°", hardMin: 0, hardMax: 90 },
  freeEnergyProxy: { label: "Free-energy proxy", unit: "proxy unit", hardMin: 0 },
  areaMsh: {
    label: "Area",
    unit: "MSH",
    hardMin: 0,
    hardMax: 1e6,
    warnAbove: 5000,
    why: "the largest recorded groups reach about 6000 MSH",
  },
  spotCount: {
    label: "Number of spots",
    unit: "spots",
    hardMin: 0,
    isInteger: true,
    warnAbove: 200,
    why: "even very large groups rarely show more than a few hundred spots",
  },
};

function isPresent(value: number | null | undefined): value is number {
  return value !== null && value !== undefined;
}

/** The hard-limit error of one value, or null when it is acceptable (or absent). */
export function explainHardLimitError(
  field: MetricField,
  value: number | null | undefined,
): string | null {
  if (!isPresent(value)) return null;
  const range = METRIC_RANGES[field];
  if (!Number.isFinite(value)) return `${range.label} must be a finite number`;
  if (range.isInteger && !Number.isInteger(value)) return `${range.label} must be a whole number`;
  if (range.hardMin !== undefined && value < range.hardMin) {
    return `${range.label} cannot be below ${range.hardMin} ${range.unit}`;
  }
  if (range.hardMax !== undefined && value > range.hardMax) {
    return `${range.label} cannot exceed ${range.hardMax} ${range.unit}`;
  }
  return null;
}

export function hardLimitErrors(input: MetricInput): MetricIssue[] {
  const issues: MetricIssue[] = [];
  for (const field of METRIC_FIELDS) {
    const message = explainHardLimitError(field, input[field]);
    if (message) issues.push({ field, message });
  }
  return issues;
}

/** Warnings for values far outside the usual range; values failing a hard limit are skipped. */
export function plausibilityWarnings(input: MetricInput): MetricIssue[] {
  const warnings: MetricIssue[] = [];
  for (const field of METRIC_FIELDS) {
    const value = input[field];
    if (!isPresent(value) || explainHardLimitError(field, value)) continue;
    const range = METRIC_RANGES[field];
    const why = range.why ? `: ${range.why}` : "";
    if (range.warnBelow !== undefined && value < range.warnBelow) {
      warnings.push({
        field,
        message: `${range.label} ${value} ${range.unit} is unusually low${why}`,
      });
    } else if (range.warnAbove !== undefined && value > range.warnAbove) {
      warnings.push({
        field,
        message: `${range.label} ${value} ${range.unit} is unusually high${why}`,
      });
    }
  }
  const area = input.areaMsh;
  if (input.spotCount === 0 && isPresent(area) && area > 0) {
    warnings.push({ field: "spotCount", message: "An area is given but the number of spots is 0" });
  }
  return warnings;
}
