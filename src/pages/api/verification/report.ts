import { searchParamsObject } from "@/lib/schemas/paging";
import { reportQuerySchema } from "@/lib/schemas/verification-report";
import { guardApi } from "@/server/auth/guards";
import { parseWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { buildReport } from "@/server/verification-desk/report.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  const query = parseWith(reportQuerySchema, searchParamsObject(ctx.url.searchParams));
  return json(await buildReport(query));
});
