import { searchParamsObject } from "@/lib/schemas/paging";
import { deliveryQuerySchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { getDeliveryProgress, listDeliverySummaries } from "@/server/dissemination/deliveries.db";
import { parseWith } from "@/server/http/body";
import { AppError } from "@/server/http/errors";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "watchDeliveries");
  const { bulletin } = parseWith(deliveryQuerySchema, searchParamsObject(ctx.url.searchParams));
  if (bulletin === undefined) return json({ bulletins: await listDeliverySummaries() });
  const progress = await getDeliveryProgress(bulletin);
  if (!progress.bulletin) throw new AppError("NOT_FOUND", "No such bulletin.");
  return json({ ...progress, generatedAt: new Date() });
});
