import { eventCorrectionSchema } from "@/lib/schemas/verification";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { AppError } from "@/server/http/errors";
import { json, withApi } from "@/server/http/handler";
import { parseIdParam } from "@/server/http/params";
import { getEvent } from "@/server/verification-desk/events.db";
import { correctEvent } from "@/server/verification-desk/events.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readVerification");
  const event = await getEvent(parseIdParam(ctx.params.id));
  if (!event) throw new AppError("NOT_FOUND", "There is no such event.");
  return json(event);
});

export const PATCH = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageVerification");
  const id = parseIdParam(ctx.params.id);
  const input = await readJsonWith(ctx.request, eventCorrectionSchema);
  return json(await correctEvent(id, input, actor));
});
