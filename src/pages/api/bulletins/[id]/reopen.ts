import { guardApi } from "@/server/auth/guards";
import { getBulletinDetail } from "@/server/bulletins/bulletin-view";
import { reopenBulletin } from "@/server/bulletins/bulletins.service";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

/** Takes a returned bulletin back to draft without changing it. */
export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "draftBulletins");
  const id = parseIdParam(ctx.params.id);
  await reopenBulletin(id, actor);
  return json(await getBulletinDetail(id, actor));
});
