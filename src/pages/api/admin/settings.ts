import { officeSettingsSchema } from "@/lib/schemas/settings";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { getOfficeSettings, saveOfficeSettings } from "@/server/settings/settings.db";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageSettings");
  return json(await getOfficeSettings());
});

export const PUT = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageSettings");
  const value = await readJsonWith(ctx.request, officeSettingsSchema);
  await saveOfficeSettings(value, actor);
  return json(value);
});
