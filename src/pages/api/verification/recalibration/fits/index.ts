import { fitRequestSchema } from "@/lib/schemas/verification-report";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { startFitJob } from "@/server/verification-desk/fit-jobs";

/** Starts a fit in the background; poll GET /api/verification/recalibration/fits/<id> for its stage. */
export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "proposeCalibration");
  const { modelId } = await readJsonWith(ctx.request, fitRequestSchema);
  return json(await startFitJob(modelId, actor), 202);
});
