import { thresholdSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { addOwnThreshold } from "@/server/dissemination/subscriptions.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const POST = withApi(async (ctx) => {
  const user = guardApi(ctx, "manageOwnSubscription");
  return json(await addOwnThreshold(user, await readJsonWith(ctx.request, thresholdSchema)), 201);
});
