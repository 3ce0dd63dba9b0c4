import { searchParamsObject } from "@/lib/schemas/paging";
import { alertListQuerySchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { getAlertBoard } from "@/server/dissemination/alert-board.db";
import { parseWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "watchAlerts");
  const filter = parseWith(alertListQuerySchema, searchParamsObject(ctx.url.searchParams));
  return json({ ...(await getAlertBoard(filter)), generatedAt: new Date() });
});
