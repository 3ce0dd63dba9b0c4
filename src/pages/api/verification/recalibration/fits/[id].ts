import { guardApi } from "@/server/auth/guards";
import { AppError } from "@/server/http/errors";
import { json, withApi } from "@/server/http/handler";
import { getFitJob, toJobJson } from "@/server/verification-desk/fit-jobs";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "proposeCalibration");
  const id = ctx.params.id ?? "";
  if (!/^[a-f0-9-]{36}$/.test(id))
    throw new AppError("BAD_REQUEST", "The fit id in the address is not valid.");
  return json(toJobJson(getFitJob(id)));
});
