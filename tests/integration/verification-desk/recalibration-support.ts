// Shared steps of the recalibration tests: find an active model, run a fit through the endpoints
// and wait for it, as a given verifier.
import { expect } from "vitest";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { FitJobJson } from "@/lib/query/verification-recalibration";
import { POST as fitRoute } from "@/pages/api/verification/recalibration/fits/index";
import { GET as fitStatusRoute } from "@/pages/api/verification/recalibration/fits/[id]";
import { waitForFitJob } from "@/server/verification-desk/fit-jobs";
import { callJson } from "./route-call";

export async function activeModelId(key: string): Promise<number> {
  const [row] = await getDb()
    .select()
    .from(models)
    .where(and(eq(models.key, key), eq(models.isActive, true)));
  return row!.id;
}

/** Starts a fit (202, running), waits for it, and checks the polled status says it is done. */
export async function runFit(key: string, verifier: CurrentUser): Promise<FitJobJson> {
  const started = await callJson(fitRoute, "/api/verification/recalibration/fits", {
    method: "POST",
    user: verifier,
    body: { modelId: await activeModelId(key) },
  });
  expect(started.status).toBe(202);
  expect(started.body.status).toBe("running");
  const done = await waitForFitJob(started.body.id);
  const polled = await callJson(fitStatusRoute, `/api/verification/recalibration/fits/${done.id}`, {
    user: verifier,
    params: { id: done.id },
  });
  expect(polled.body).toMatchObject({ status: "done", done: 5, total: 5 });
  return done;
}
