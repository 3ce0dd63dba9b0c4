import { searchParamsObject } from "@/lib/schemas/paging";
import { exportQuerySchema, reportQuerySchema } from "@/lib/schemas/verification-report";
import { guardApi } from "@/server/auth/guards";
import { parseWith } from "@/server/http/body";
import { withApi } from "@/server/http/handler";
import { exportPairs, exportScores } from "@/server/verification-desk/export.service";

/** CSV of the report's matched pairs (what=pairs) or its score table (what=scores). */
export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  const params = searchParamsObject(ctx.url.searchParams);
  const { what } = parseWith(exportQuerySchema, params);
  const query = parseWith(reportQuerySchema, params);
  const file = what === "pairs" ? await exportPairs(query) : await exportScores(query);
  return new Response(file.text, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${file.filename}"`,
      "Cache-Control": "no-store",
    },
  });
});
