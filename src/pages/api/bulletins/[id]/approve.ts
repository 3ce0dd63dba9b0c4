import { approveBulletinSchema } from "@/lib/schemas/bulletins";
import { guardApi } from "@/server/auth/guards";
import { getBulletinDetail } from "@/server/bulletins/bulletin-view";
import { approveBulletin } from "@/server/bulletins/issue.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

/** Approves and issues the bulletin; the body may carry the revision and content fingerprint seen. */
export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "reviewBulletins");
  const id = parseIdParam(ctx.params.id);
  const hasBody = ctx.request.headers.get("content-length") !== "0" && ctx.request.body !== null;
  const seen = hasBody ? await readJsonWith(ctx.request, approveBulletinSchema) : {};
  const issued = await approveBulletin(id, seen, actor);
  const { row: _row, ...issue } = issued;
  return json({ ...(await getBulletinDetail(id, actor)), issue });
});
