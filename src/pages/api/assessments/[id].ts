import { guardApi } from "@/server/auth/guards";
import { readJson } from "@/server/http/body";
import { AppError } from "@/server/http/errors";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { getAssessment, listGuidanceFor } from "@/server/forecast/assessments.db";
import { updateAssessment } from "@/server/forecast/assessments.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readAssessments");
  const id = parseIdParam(ctx.params.id);
  const assessment = await getAssessment(id);
  if (!assessment) throw new AppError("NOT_FOUND", "No such assessment.");
  const guidance = await listGuidanceFor(id);
  return json({ ...assessment, guidance: guidance.map(({ modelKey, modelVersion, inputs, probabilities, flags, missingInputs, computedAt }) => ({ modelKey, modelVersion, inputs, probabilities, flags, missingInputs, computedAt })) });
});

export const PATCH = withApi(async (ctx) => {
  const actor = guardApi(ctx, "editAssessments");
  const id = parseIdParam(ctx.params.id);
  return json(await updateAssessment(id, await readJson(ctx.request), actor));
});
