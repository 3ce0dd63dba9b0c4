import { mailboxQuerySchema, searchParamsObject } from "@/lib/schemas/paging";
import { guardApi } from "@/server/auth/guards";
import { listCaught } from "@/server/delivery/mailbox";
import { parseWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readMailbox");
  const q = parseWith(mailboxQuerySchema, searchParamsObject(ctx.url.searchParams));
  const { total, messages } = await listCaught(q);
  return json({
    total,
    page: q.page,
    pageSize: q.pageSize,
    messages: messages.map(({ id, to, subject, receivedAt, from }) => ({ id, from, to, subject, receivedAt })),
  });
});
