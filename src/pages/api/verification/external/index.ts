import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import {
  commitExternalUpload,
  listExternalSeries,
  previewExternalUpload,
  readExternalUploadRequest,
} from "@/server/verification-desk/external.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  return json({ series: await listExternalSeries() });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageVerification");
  const input = await readExternalUploadRequest(ctx.request);
  if (input.mode === "preview") return json(previewExternalUpload(input));
  return json(await commitExternalUpload(input, actor), 201);
});
