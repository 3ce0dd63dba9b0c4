import { auditQuerySchema, searchParamsObject } from "@/lib/schemas/paging";
import { listAudit } from "@/server/audit/audit.db";
import { guardApi } from "@/server/auth/guards";
import { parseWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readAudit");
  const q = parseWith(auditQuerySchema, searchParamsObject(ctx.url.searchParams));
  const to = q.to ? new Date(Date.parse(`${q.to}T00:00:00Z`) + 86_400_000) : undefined;
  const result = await listAudit({ ...q, from: q.from ? new Date(`${q.from}T00:00:00Z`) : undefined, to });
  return json({ ...result, page: q.page, pageSize: q.pageSize });
});
