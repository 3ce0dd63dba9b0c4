import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { calibrationProposals, models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { POST as fitRoute } from "@/pages/api/verification/recalibration/fits/index";
import {
  GET as listProposalsRoute,
  POST as proposeRoute,
} from "@/pages/api/verification/recalibration/proposals/index";
import { POST as rejectRoute } from "@/pages/api/verification/recalibration/proposals/[id]/reject";
import { seedDemoModels } from "@/server/forecast/models.db";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { insertGeneratedArchive } from "./archive-fixture";
import { activeModelId as modelId, runFit } from "./recalibration-support";
import { callJson, createPerson } from "./route-call";

let verifier: CurrentUser;
let admin: CurrentUser;
const fit = (key: string) => runFit(key, verifier);

beforeAll(async () => {
  await useTestDatabase();
  await seedDemoModels();
  verifier = await createPerson("verifier", "verifier@rates.example");
  admin = await createPerson("admin", "admin@rates.example");
  await insertGeneratedArchive({ from: "2030-01-01", days: 730, seed: 4242 });
});
afterAll(closeTestDatabase);

describe("fitting the McIntosh–Poisson table", () => {
  it("fits rates, is proposed and can be rejected by an admin", async () => {
    const job = await fit("mcintosh-poisson");
    expect(job.result!.poisson!.rows.length).toBe(7);
    expect(job.result!.poisson!.zurichFromArchive).toEqual(["A"]);
    const proposed = await callJson(proposeRoute, "/api/verification/recalibration/proposals", {
      method: "POST",
      user: verifier,
      body: { jobId: job.id },
    });
    const id = String(proposed.body.id);
    const noReason = await callJson(rejectRoute, `/x/${id}`, {
      method: "POST",
      user: admin,
      params: { id },
      body: { reason: "" },
    });
    expect(noReason.status).toBe(400);
    expect(
      (
        await callJson(rejectRoute, `/x/${id}`, {
          method: "POST",
          user: admin,
          params: { id },
          body: { reason: "Wait for the next cycle" },
        })
      ).status,
    ).toBe(204);
    const [row] = await getDb()
      .select()
      .from(calibrationProposals)
      .where(eq(calibrationProposals.id, Number(id)));
    expect(row?.status).toBe("rejected");
    const list = await callJson(listProposalsRoute, "/api/verification/recalibration/proposals", {
      user: verifier,
    });
    expect(list.body.proposals.map((p: { status: string }) => p.status)).toEqual(["rejected"]);
    const demo = await getDb()
      .select()
      .from(models)
      .where(and(eq(models.key, "mcintosh-poisson"), eq(models.isActive, true)));
    expect(demo.map((m) => m.version)).toEqual(["demo-1"]);
  });

  it("refuses a model with nothing to fit, and an unknown one, before starting", async () => {
    const persistence = await callJson(fitRoute, "/api/verification/recalibration/fits", {
      method: "POST",
      user: verifier,
      body: { modelId: await modelId("flare-history") },
    });
    expect(persistence.status).toBe(400);
    expect(persistence.body.error.message).toMatch(/nothing to fit/);
    expect(
      (
        await callJson(fitRoute, "/api/verification/recalibration/fits", {
          method: "POST",
          user: verifier,
          body: { modelId: 99999 },
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await callJson(fitRoute, "/api/verification/recalibration/fits", {
          method: "POST",
          user: admin,
          body: { modelId: 1 },
        })
      ).status,
    ).toBe(403);
  });
});
