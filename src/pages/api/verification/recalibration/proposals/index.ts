import { proposalRequestSchema } from "@/lib/schemas/verification-report";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { listProposals } from "@/server/verification-desk/proposals.db";
import { proposeCalibration } from "@/server/verification-desk/proposals.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  return json({ proposals: await listProposals() });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "proposeCalibration");
  const { jobId } = await readJsonWith(ctx.request, proposalRequestSchema);
  return json(await proposeCalibration(jobId, actor), 201);
});
