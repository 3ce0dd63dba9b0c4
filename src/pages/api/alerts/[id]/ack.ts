import { deskAckSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { acknowledgeForContact } from "@/server/dissemination/acknowledge";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

// A duty officer records an acknowledgement the contact gave by phone or radio.
export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "watchAlerts");
  const id = parseIdParam(ctx.params.id);
  const { note } = await readJsonWith(ctx.request, deskAckSchema);
  return json(await acknowledgeForContact(actor, id, note));
});
