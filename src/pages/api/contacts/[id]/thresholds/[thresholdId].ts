import { thresholdSchema } from "@/lib/schemas/subscriptions";
import { guardApi } from "@/server/auth/guards";
import { changeThreshold, removeThreshold } from "@/server/dissemination/thresholds.service";
import { readJsonWith } from "@/server/http/body";
import { json, noContent, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";

export const PUT = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  const contactId = parseIdParam(ctx.params.id);
  const thresholdId = parseIdParam(ctx.params.thresholdId, "thresholdId");
  return json(
    await changeThreshold(
      contactId,
      thresholdId,
      await readJsonWith(ctx.request, thresholdSchema),
      actor,
      "desk",
    ),
  );
});

export const DELETE = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageContacts");
  await removeThreshold(
    parseIdParam(ctx.params.id),
    parseIdParam(ctx.params.thresholdId, "thresholdId"),
    actor,
    "desk",
  );
  return noContent();
});
