import { acceptInvitationSchema } from "@/lib/schemas/users";
import { allowPublic } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { acceptInvitation } from "@/server/users/users.service";

// Public: the signed, single-use token in the body is the authorisation.
export const POST = withApi(async (ctx) => {
  allowPublic();
  const input = await readJsonWith(ctx.request, acceptInvitationSchema);
  return json(await acceptInvitation(input.token, input.password));
});
