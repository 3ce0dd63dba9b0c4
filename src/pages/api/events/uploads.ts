import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import {
  commitEventUpload,
  previewEventUpload,
  readEventUploadRequest,
} from "@/server/verification-desk/event-upload.service";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageVerification");
  const input = await readEventUploadRequest(ctx.request);
  if (input.mode === "preview") return json(await previewEventUpload(input));
  return json(await commitEventUpload(input, actor), 201);
});
