import { rejectionSchema } from "@/lib/schemas/verification-report";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { noContent, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { rejectProposal } from "@/server/verification-desk/proposals.service";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "activateCalibration");
  const id = parseIdParam(ctx.params.id);
  const { reason } = await readJsonWith(ctx.request, rejectionSchema);
  await rejectProposal(id, actor, reason);
  return noContent();
});
