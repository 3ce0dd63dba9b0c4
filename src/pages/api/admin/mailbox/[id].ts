import { guardApi } from "@/server/auth/guards";
import { getCaught } from "@/server/delivery/mailbox";
import { AppError } from "@/server/http/errors";
import { json, withApi } from "@/server/http/handler";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readMailbox");
  const id = ctx.params.id ?? "";
  if (!/^[\w-]{1,100}$/.test(id)) throw new AppError("BAD_REQUEST", "Not a message id.", { fields: { id: "Not a message id." } });
  return json(await getCaught(id));
});
