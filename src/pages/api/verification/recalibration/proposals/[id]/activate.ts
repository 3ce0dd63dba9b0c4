import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { activateProposal } from "@/server/verification-desk/proposals.service";

/** Creates the proposal's model version and makes it the key's active one. */
export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "activateCalibration");
  return json(await activateProposal(parseIdParam(ctx.params.id), actor), 201);
});
