import { updateUserSchema } from "@/lib/schemas/users";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { noContent, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { updateUser } from "@/server/users/users.service";

export const PATCH = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageUsers");
  const id = parseIdParam(ctx.params.id);
  await updateUser(id, await readJsonWith(ctx.request, updateUserSchema), actor);
  return noContent();
});
