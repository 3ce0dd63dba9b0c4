import { modelActivationSchema } from "@/lib/schemas/models";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { setModelActive } from "@/server/forecast/models.service";

export const PATCH = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageModels");
  const id = parseIdParam(ctx.params.id);
  const { isActive } = await readJsonWith(ctx.request, modelActivationSchema);
  return json({ versions: await setModelActive(id, isActive, actor) });
});
