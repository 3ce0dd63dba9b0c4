import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import { listSources } from "@/server/verification-desk/records.db";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  return json({ sources: await listSources() });
});
