import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { FitJobJson } from "@/lib/query/verification-recalibration";
import { POST as proposeRoute } from "@/pages/api/verification/recalibration/proposals/index";
import { POST as activateRoute } from "@/pages/api/verification/recalibration/proposals/[id]/activate";
import { getActiveModels, seedDemoModels } from "@/server/forecast/models.db";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { insertGeneratedArchive, type GeneratedArchive } from "./archive-fixture";
import { runFit } from "./recalibration-support";
import { callJson, countTables, createPerson } from "./route-call";

let verifier: CurrentUser;
let admin: CurrentUser;
let archive: GeneratedArchive;
const fit = (key: string) => runFit(key, verifier);

beforeAll(async () => {
  await useTestDatabase();
  await seedDemoModels();
  verifier = await createPerson("verifier", "verifier@recal.example");
  admin = await createPerson("admin", "admin@recal.example");
  archive = await insertGeneratedArchive({ from: "2030-01-01", days: 730, seed: 4242 });
});
afterAll(closeTestDatabase);

describe("fitting the logistic model on the archive", () => {
  let job: FitJobJson;
  beforeAll(async () => {
    job = await fit("logistic-magnetic");
  });

  it("fits coefficients with standard errors for every level and reports convergence", () => {
    const result = job.result!;
    expect(result.archive).toMatchObject({
      from: "2030-01-01",
      to: archive.to,
      regionDays: archive.regionDays,
      isDemo: true,
    });
    expect(result.logistic?.levels.map((l) => [l.level, l.converged, l.n])).toEqual([
      ["C+", true, archive.regionDays],
      ["M+", true, archive.regionDays],
      ["X", true, archive.regionDays],
    ]);
    const m = result.logistic!.levels[1]!;
    expect(m.coefficients.map((c) => c.term)).toEqual([
      "intercept",
      "log10(unsignedFluxMx)",
      "identity(logR)",
      "identity(meanShearDeg)",
      "identity(pilLengthMm)",
    ]);
    for (const c of m.coefficients) expect(c.standardError).toBeGreaterThan(0);
    // The archive was drawn with an M-class slope of 1.1 on log10 Φ: the fit finds it within 3 SE.
    const flux = m.coefficients[1]!;
    expect(Math.abs(flux.estimate! - 1.1)).toBeLessThan(3 * flux.standardError!);
    expect(m.deviance!).toBeLessThan(m.nullDeviance!);
  });

  it("compares candidate and active on the held-out last year", () => {
    const result = job.result!;
    expect(result.split).toEqual({
      trainFrom: "2030-01-01",
      trainTo: expect.any(String),
      testFrom: expect.any(String),
      testTo: archive.to,
    });
    expect(result.holdout.levels).toHaveLength(3);
    const mPlus = result.holdout.levels!.find((l) => l.level === "M+")!;
    expect(mPlus.n).toBeGreaterThan(800);
    expect(mPlus.candidate.bss.value).not.toBeNull();
    expect(mPlus.active.reliability).toHaveLength(10);
    expect(result.isProposable).toBe(true);
  });

  it("becomes a proposal, and an admin's activation creates a new active version", async () => {
    const before = await countTables();
    expect(
      (
        await callJson(proposeRoute, "/api/verification/recalibration/proposals", {
          method: "POST",
          user: admin,
          body: { jobId: job.id },
        })
      ).status,
    ).toBe(403);
    const proposed = await callJson(proposeRoute, "/api/verification/recalibration/proposals", {
      method: "POST",
      user: verifier,
      body: { jobId: job.id },
    });
    expect(proposed.status).toBe(201);
    expect(proposed.body).toMatchObject({
      status: "proposed",
      modelKey: "logistic-magnetic",
      kind: "logistic",
      proposedBy: verifier.email,
    });
    expect((await countTables()).calibration_proposals).toBe(before.calibration_proposals + 1);
    // A fit is proposed once.
    expect(
      (
        await callJson(proposeRoute, "/api/verification/recalibration/proposals", {
          method: "POST",
          user: verifier,
          body: { jobId: job.id },
        })
      ).status,
    ).toBe(404);

    const id = String(proposed.body.id);
    expect(
      (
        await callJson(activateRoute, `/x/${id}`, {
          method: "POST",
          user: verifier,
          params: { id },
        })
      ).status,
    ).toBe(403);
    const activated = await callJson(activateRoute, `/x/${id}`, {
      method: "POST",
      user: admin,
      params: { id },
    });
    expect(activated.status).toBe(201);
    const versions = await getDb()
      .select()
      .from(models)
      .where(eq(models.key, "logistic-magnetic"))
      .orderBy(models.id);
    expect(versions.map((v) => [v.version, v.isActive])).toEqual([
      ["demo-1", false],
      [activated.body.version, true],
    ]);
    const created = versions[1]!;
    expect(created.provenance).toBe(
      `fitted by Facula on the office archive 2030-01-01 – ${archive.to}; demo data`,
    );
    expect(created.isDemo).toBe(true);
    const fitted = job.result!.logistic!.levels[1]!.coefficients[1]!.estimate;
    expect(
      (created.params as { levels: { "M+": { predictors: { coefficient: number }[] } } }).levels[
        "M+"
      ].predictors[0]!.coefficient,
    ).toBe(fitted);
    const active = await getActiveModels();
    expect(active.find((m) => m.compiled.key === "logistic-magnetic")?.compiled.version).toBe(
      activated.body.version,
    );
    const [audit] = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "calibration.activated"));
    expect(audit?.details).toMatchObject({
      proposalId: Number(id),
      version: activated.body.version,
      deactivated: ["demo-1"],
    });
    expect(
      (await callJson(activateRoute, `/x/${id}`, { method: "POST", user: admin, params: { id } }))
        .status,
    ).toBe(409);
  });
});
