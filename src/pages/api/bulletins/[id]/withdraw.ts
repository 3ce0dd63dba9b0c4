import { withdrawBulletinSchema } from "@/lib/schemas/bulletins";
import { guardApi } from "@/server/auth/guards";
import { getBulletinDetail } from "@/server/bulletins/bulletin-view";
import { withdrawBulletin } from "@/server/bulletins/bulletins.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "reviewBulletins");
  const id = parseIdParam(ctx.params.id);
  await withdrawBulletin(id, await readJsonWith(ctx.request, withdrawBulletinSchema), actor);
  return json(await getBulletinDetail(id, actor));
});
