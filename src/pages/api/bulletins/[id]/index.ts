import { editBulletinSchema } from "@/lib/schemas/bulletins";
import { guardApi } from "@/server/auth/guards";
import { getBulletinDetail } from "@/server/bulletins/bulletin-view";
import { editBulletin } from "@/server/bulletins/bulletins.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

export const GET = withApi(async (ctx) => {
  const viewer = guardApi(ctx, "readBulletins");
  return json(await getBulletinDetail(parseIdParam(ctx.params.id), viewer));
});

/** Edits the discussion of a draft or returned bulletin (a returned one becomes a draft again). */
export const PATCH = withApi(async (ctx) => {
  const actor = guardApi(ctx, "draftBulletins");
  const id = parseIdParam(ctx.params.id);
  await editBulletin(id, await readJsonWith(ctx.request, editBulletinSchema), actor);
  return json(await getBulletinDetail(id, actor));
});
