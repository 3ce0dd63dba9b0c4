import { thresholdSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { addThreshold } from "@/server/dissemination/thresholds.service";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  const contactId = parseIdParam(ctx.params.id);
  return json(
    await addThreshold(contactId, await readJsonWith(ctx.request, thresholdSchema), actor, "desk"),
    201,
  );
});
