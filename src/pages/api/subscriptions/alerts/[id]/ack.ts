import { guardApi } from "@/server/auth/guards";
import { acknowledgeOwnAlert } from "@/server/dissemination/acknowledge";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

export const POST = withApi(async (ctx) => {
  const user = guardApi(ctx, "manageOwnSubscription");
  return json(await acknowledgeOwnAlert(user, parseIdParam(ctx.params.id)));
});
