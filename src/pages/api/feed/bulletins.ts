import { feedQuerySchema } from "@/lib/schemas/bulletins";
import { searchParamsObject } from "@/lib/schemas/paging";
import { allowPublic, guardApi } from "@/server/auth/guards";
import { buildFeed } from "@/server/bulletins/feed";
import { parseWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { getOfficeSettings } from "@/server/settings/settings.db";

/** Published bulletins as versioned JSON: public when the office allows it, else signed-in readers. */
export const GET = withApi(async (ctx) => {
  const office = await getOfficeSettings();
  if (office.isPublicBulletinsAllowed) allowPublic();
  else guardApi(ctx, "readBulletins");
  const query = parseWith(feedQuerySchema, searchParamsObject(ctx.url.searchParams));
  const feed = await buildFeed(query);
  return json(feed, 200, {
    "Cache-Control": office.isPublicBulletinsAllowed ? "public, max-age=60" : "private, no-store",
  });
});
