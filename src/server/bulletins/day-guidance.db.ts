// The stored model guidance of a forecast day's assessments, per region and model, as the review
// screen shows it and as the forecast records of an issued bulletin keep it.
import { asc, eq } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { assessments, guidance, models, regions } from "@/db/schema";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";

export interface StoredGuidance {
  region: string;
  modelKey: string;
  modelVersion: string;
  modelName: string;
  probabilities: ProbabilityGrid | null;
  flags: string[];
  missingInputs: string[];
}

export async function listGuidanceForDay(
  day: string,
  tx: Db | Tx = getDb(),
): Promise<StoredGuidance[]> {
  return tx
    .select({
      region: regions.number,
      modelKey: guidance.modelKey,
      modelVersion: guidance.modelVersion,
      modelName: models.name,
      probabilities: guidance.probabilities,
      flags: guidance.flags,
      missingInputs: guidance.missingInputs,
    })
    .from(guidance)
    .innerJoin(assessments, eq(guidance.assessmentId, assessments.id))
    .innerJoin(regions, eq(assessments.regionId, regions.id))
    .innerJoin(models, eq(guidance.modelId, models.id))
    .where(eq(assessments.forecastDay, day))
    .orderBy(asc(regions.number), asc(guidance.modelKey));
}
