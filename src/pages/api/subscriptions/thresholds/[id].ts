import { thresholdSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import {
  changeOwnThreshold,
  removeOwnThreshold,
} from "@/server/dissemination/subscriptions.service";
import { readJsonWith } from "@/server/http/body";
import { json, noContent, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

// Only the caller's own thresholds: another contact's answers 403 (see subscriptions.service.ts).
export const PUT = withApi(async (ctx) => {
  const user = guardApi(ctx, "manageOwnSubscription");
  const id = parseIdParam(ctx.params.id);
  return json(await changeOwnThreshold(user, id, await readJsonWith(ctx.request, thresholdSchema)));
});

export const DELETE = withApi(async (ctx) => {
  const user = guardApi(ctx, "manageOwnSubscription");
  await removeOwnThreshold(user, parseIdParam(ctx.params.id));
  return noContent();
});
