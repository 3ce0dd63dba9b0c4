import { z } from "zod";
import { createAssessmentSchema, forecastDaySchema } from "@/lib/schemas/assessment";
import { searchParamsObject } from "@/lib/schemas/paging";
import { guardApi } from "@/server/auth/guards";
import { parseWith, readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { findPreviousAssessment, listDay } from "@/server/forecast/assessments.db";
import { createAssessment } from "@/server/forecast/assessments.service";

const listQuery = z.union([
  z.object({ day: forecastDaySchema }).strict(),
  z.object({ region: z.string().trim().min(1).max(20), before: forecastDaySchema }).strict(),
], { error: "Ask for ?day=YYYY-MM-DD, or ?region=HR-0412&before=YYYY-MM-DD for the previous assessment." });

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "readAssessments");
  const q = parseWith(listQuery, searchParamsObject(ctx.url.searchParams));
  if ("day" in q) return json({ day: q.day, assessments: await listDay(q.day) });
  return json({ previous: await findPreviousAssessment(q.region, q.before) });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "editAssessments");
  const data = await readJsonWith(ctx.request, createAssessmentSchema);
  return json(await createAssessment(data, actor), 201);
});
