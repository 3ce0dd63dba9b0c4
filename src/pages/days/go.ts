import type { APIRoute } from "astro";
import { forecastDaySchema } from "@/lib/schemas/assessment";
import { guardApi } from "@/server/auth/guards";
import { errorResponse } from "@/server/http/errors";
import { parseWith } from "@/server/http/body";

// The "open a day" form lands here and is sent on to the day's page.
export const GET: APIRoute = (ctx) => {
  if (!ctx.locals.user) return ctx.redirect("/sign-in?next=/days", 303);
  try {
    guardApi(ctx, "readAssessments");
    return ctx.redirect(`/days/${parseWith(forecastDaySchema, ctx.url.searchParams.get("day") ?? "")}`, 303);
  } catch (err) {
    return errorResponse(err);
  }
};
