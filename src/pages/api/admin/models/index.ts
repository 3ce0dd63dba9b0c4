import { modelImportSchema } from "@/lib/schemas/models";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { importModelVersion, listModelVersions } from "@/server/forecast/models.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageModels");
  return json({ models: await listModelVersions() });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageModels");
  const input = await readJsonWith(ctx.request, modelImportSchema);
  return json(await importModelVersion(input, actor), 201);
});
