import { assessmentInputSchema } from "@/lib/schemas/assessment";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { computeGuidance, toModelInput } from "@/server/forecast/guidance.service";

// Scores an assessment with every active model without saving anything.
export const POST = withApi(async (ctx) => {
  guardApi(ctx, "editAssessments");
  const input = await readJsonWith(ctx.request, assessmentInputSchema);
  const answer = await computeGuidance(toModelInput(input));
  return json({
    models: answer.models.map(({ key, name, version, provenance, probabilities, missingInputs, flags, reason }) => ({ key, name, version, provenance, probabilities, missingInputs, flags, reason })),
    blended: answer.blended,
    spread: answer.spread,
    flags: answer.blendFlags,
  });
});
