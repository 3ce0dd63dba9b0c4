import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import {
  commitCsvImport,
  previewCsvImport,
  readCsvImportRequest,
} from "@/server/forecast/csv-import";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "editAssessments");
  const input = await readCsvImportRequest(ctx.request);
  if (input.mode === "preview") return json(await previewCsvImport(input));
  return json(await commitCsvImport(input, actor), 201);
});
