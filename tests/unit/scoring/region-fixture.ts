import type { AssessmentInput } from "@/lib/domain/assessment-input";

/** An invented demo region; tests override the fields they exercise. */
export function buildRegion(overrides: Partial<AssessmentInput> = {}): AssessmentInput {
  return {
    region: "HR-0412",
    location: "N12E34",
    areaMsh: 240,
    spotCount: 14,
    mcintosh: "Dai",
    mountWilson: "beta-gamma",
    unsignedFluxMx: 1e22,
    pilLengthMm: 50,
    logR: 4,
    meanShearDeg: 40,
    freeEnergyProxy: 1e31,
    flares24h: { C: 2, M: 0, X: 0 },
    ...overrides,
  };
}
