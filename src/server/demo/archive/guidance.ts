// Guidance of every demo model for one generated region-day, scored exactly as the live desk
// scores it (compiled DEMO_MODELS), and blended with equal weights.

import type { AssessmentInput } from "@/lib/domain/assessment-input";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import { blendGuidance } from "@/server/scoring/blend";
import { DEMO_MODELS } from "@/server/scoring/demo-models";
import { compileModel, type CompiledModel } from "@/server/scoring/models";

export interface ArchiveGuidance {
  key: string;
  version: string;
  probabilities: ProbabilityGrid | null;
  flags: string[];
  missingInputs: string[];
  reason: string | null;
}

let compiled: CompiledModel[] | null = null;

/** The active demo models, compiled once per process. */
export function listDemoScorers(): CompiledModel[] {
  compiled ??= DEMO_MODELS.filter((m) => m.active).map(compileModel);
  return compiled;
}

/** "model:<key>@<version>", the forecast-record source of a model's guidance. */
export function formatModelSource(key: string, version: string): string {
  return `model:${key}@${version}`;
}

export function scoreRegionDay(input: AssessmentInput): {
  guidance: ArchiveGuidance[];
  blended: ProbabilityGrid | null;
} {
  const guidance = listDemoScorers().map((model) => {
    const r = model.score(input);
    return {
      key: r.key,
      version: r.version,
      probabilities: r.probabilities,
      flags: r.flags,
      missingInputs: r.missingInputs,
      reason: r.reason,
    };
  });
  const blend = blendGuidance(
    guidance.map((g) => ({ key: g.key, probabilities: g.probabilities })),
  );
  return { guidance, blended: blend.probabilities };
}
