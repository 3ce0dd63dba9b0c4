import { eventEntrySchema, eventListQuerySchema } from "@/lib/schemas/verification";
import { searchParamsObject } from "@/lib/schemas/paging";
import { guardApi } from "@/server/auth/guards";
import { parseWith, readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { listEvents } from "@/server/verification-desk/events.db";
import { createEvent } from "@/server/verification-desk/events.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  const query = parseWith(eventListQuerySchema, searchParamsObject(ctx.url.searchParams));
  const { rows, total } = await listEvents(query);
  return json({ events: rows, total, page: query.page, pageSize: query.pageSize });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageVerification");
  const input = await readJsonWith(ctx.request, eventEntrySchema);
  return json(await createEvent(input, actor), 201);
});
