// Live guidance: scores one region input with every active model and blends the results.
import type { AssessmentInput } from "@/lib/domain/assessment-input";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import { blendGuidance } from "@/server/scoring/blend";
import { getActiveModels } from "./models.db";

export interface ModelGuidance {
  modelId: number;
  key: string;
  name: string;
  version: string;
  provenance: string;
  probabilities: ProbabilityGrid | null;
  missingInputs: string[];
  flags: string[];
  reason: string | null;
}

export interface GuidanceAnswer {
  models: ModelGuidance[];
  blended: ProbabilityGrid | null;
  spread: ProbabilityGrid | null;
  blendFlags: string[];
  blendReason: string | null;
}

export async function computeGuidance(input: AssessmentInput): Promise<GuidanceAnswer> {
  const active = await getActiveModels();
  const results = active.map(({ id, compiled }) => {
    const r = compiled.score(input);
    return { modelId: id, key: r.key, name: compiled.name, version: r.version, provenance: r.provenance, probabilities: r.probabilities, missingInputs: r.missingInputs, flags: r.flags, reason: r.reason };
  });
  const blend = blendGuidance(results.map((r) => ({ key: r.key, probabilities: r.probabilities })));
  return { models: results, blended: blend.probabilities, spread: blend.spread, blendFlags: blend.flags, blendReason: blend.reason };
}

/** The assessment data as the models see it (nulls for unmeasured metrics). */
export function toModelInput(data: {
  region: string;
  location: string;
  areaMsh: number;
  spotCount: number;
  mcintosh: string;
  mountWilson: string;
  unsignedFluxMx?: number | null | undefined;
  pilLengthMm?: number | null | undefined;
  logR?: number | null | undefined;
  meanShearDeg?: number | null | undefined;
  freeEnergyProxy?: number | null | undefined;
  flares24h: { C: number; M: number; X: number };
}): AssessmentInput {
  return {
    region: data.region,
    location: data.location,
    areaMsh: data.areaMsh,
    spotCount: data.spotCount,
    mcintosh: data.mcintosh,
    mountWilson: data.mountWilson,
    unsignedFluxMx: data.unsignedFluxMx ?? null,
    pilLengthMm: data.pilLengthMm ?? null,
    logR: data.logR ?? null,
    meanShearDeg: data.meanShearDeg ?? null,
    freeEnergyProxy: data.freeEnergyProxy ?? null,
    flares24h: { ...data.flares24h },
  };
}
