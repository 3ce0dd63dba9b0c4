import { rememberedMappingSchema } from "@/lib/schemas/csv-import";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { getRememberedMapping, saveRememberedMapping } from "@/server/forecast/csv-mapping";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "editAssessments");
  return json({ mapping: await getRememberedMapping() });
});

export const PUT = withApi(async (ctx) => {
  const actor = guardApi(ctx, "editAssessments");
  const { mapping } = await readJsonWith(ctx.request, rememberedMappingSchema);
  return json({ mapping: await saveRememberedMapping(mapping, actor) });
});
