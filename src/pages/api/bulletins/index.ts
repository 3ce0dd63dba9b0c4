import { bulletinListQuerySchema, createBulletinSchema } from "@/lib/schemas/bulletins";
import { searchParamsObject } from "@/lib/schemas/paging";
import { guardApi } from "@/server/auth/guards";
import { getBulletinDetail, listBulletinsFor } from "@/server/bulletins/bulletin-view";
import { createBulletin } from "@/server/bulletins/create-bulletin.service";
import { parseWith, readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  const viewer = guardApi(ctx, "readBulletins");
  const query = parseWith(bulletinListQuerySchema, searchParamsObject(ctx.url.searchParams));
  return json(await listBulletinsFor(viewer, query));
});

/** Starts the day's bulletin, or a correction when the day's latest bulletin is issued. */
export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "draftBulletins");
  const row = await createBulletin(await readJsonWith(ctx.request, createBulletinSchema), actor);
  return json(await getBulletinDetail(row.id, actor), 201, {
    Location: `/api/bulletins/${row.id}`,
  });
});
