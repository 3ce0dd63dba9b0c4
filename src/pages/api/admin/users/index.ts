import { inviteSchema } from "@/lib/schemas/users";
import { searchParamsObject, userListQuerySchema } from "@/lib/schemas/paging";
import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import { parseWith, readJsonWith } from "@/server/http/body";
import { listUsers } from "@/server/users/users.db";
import { inviteUser } from "@/server/users/users.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageUsers");
  const query = parseWith(userListQuerySchema, searchParamsObject(ctx.url.searchParams));
  const { rows, total } = await listUsers(query);
  return json({ users: rows, total, page: query.page, pageSize: query.pageSize });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageUsers");
  const input = await readJsonWith(ctx.request, inviteSchema);
  return json(await inviteUser(input, actor), 201);
});
