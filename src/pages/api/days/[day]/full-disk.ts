import { forecastDaySchema } from "@/lib/schemas/assessment";
import { fullDiskAdjustmentSchema } from "@/lib/schemas/full-disk";
import { guardApi } from "@/server/auth/guards";
import { parseWith, readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { getFullDisk, saveFullDiskAdjustments } from "@/server/forecast/full-disk.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readAssessments");
  return json(await getFullDisk(parseWith(forecastDaySchema, ctx.params.day)));
});

export const PUT = withApi(async (ctx) => {
  const actor = guardApi(ctx, "editAssessments");
  const day = parseWith(forecastDaySchema, ctx.params.day);
  return json(await saveFullDiskAdjustments(day, await readJsonWith(ctx.request, fullDiskAdjustmentSchema), actor));
});
