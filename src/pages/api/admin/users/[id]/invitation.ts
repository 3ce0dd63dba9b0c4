import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { resendInvitation } from "@/server/users/users.service";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageUsers");
  return json(await resendInvitation(parseIdParam(ctx.params.id), actor), 201);
});
