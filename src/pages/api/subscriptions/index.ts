import { subscriptionPrefsSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import {
  getOwnSubscription,
  setOwnPreferences,
} from "@/server/dissemination/subscriptions.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  const user = guardApi(ctx, "manageOwnSubscription");
  return json({ subscription: await getOwnSubscription(user) });
});

export const PATCH = withApi(async (ctx) => {
  const user = guardApi(ctx, "manageOwnSubscription");
  return json(
    await setOwnPreferences(user, await readJsonWith(ctx.request, subscriptionPrefsSchema)),
  );
});
