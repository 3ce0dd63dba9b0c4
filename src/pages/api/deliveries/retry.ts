import { retryDeliveriesSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { retryFailedDeliveries } from "@/server/dissemination/deliveries.db";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "watchDeliveries");
  const requeued = await retryFailedDeliveries(
    await readJsonWith(ctx.request, retryDeliveriesSchema),
    actor,
  );
  return json({ requeued });
});
