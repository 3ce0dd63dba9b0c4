import { searchParamsObject } from "@/lib/schemas/paging";
import { reportQuerySchema } from "@/lib/schemas/verification-report";
import { guardApi } from "@/server/auth/guards";
import { parseWith } from "@/server/http/body";
import { withApi } from "@/server/http/handler";
import { streamIntervals } from "@/server/verification-desk/intervals.service";

/** Bootstrap intervals of the report, streamed as JSON lines: progress messages, then the result. */
export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  const query = parseWith(reportQuerySchema, searchParamsObject(ctx.url.searchParams));
  return new Response(streamIntervals(query), {
    headers: { "Content-Type": "application/x-ndjson; charset=utf-8", "Cache-Control": "no-store" },
  });
});
