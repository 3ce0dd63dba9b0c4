import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET } from "@/pages/api/admin/models/index";
import { getActiveModels, seedDemoModels } from "@/server/forecast/models.db";
import { DEMO_MODELS } from "@/server/scoring/demo-models";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callRoute, createActor } from "./api-call";
import {
  activate as toggle,
  importModel,
  PROVENANCE,
  RATE_CSV,
  demoRateParams,
} from "./models-fixture";

let admin: CurrentUser;
const activate = (id: number, isActive: boolean) => toggle(id, isActive, admin);

beforeAll(async () => {
  await useTestDatabase();
  await seedDemoModels();
  admin = await createActor("admin", "admin@halden.example");
  const base = {
    key: "mcintosh-poisson",
    kind: "mcintosh-poisson",
    name: "Rates",
    provenance: PROVENANCE,
  };
  await importModel({ ...base, version: "test-json", params: demoRateParams() }, admin);
  await importModel(
    { ...base, format: "csv", version: "test-csv", csv: RATE_CSV, correctionFactor: 0.5 },
    admin,
  );
});
afterAll(closeTestDatabase);

describe("activation", () => {
  it("activating a version deactivates the key's other versions, and guidance follows", async () => {
    const [csvRow] = await getDb().select().from(models).where(eq(models.version, "test-csv"));
    const { status, body } = await activate(csvRow!.id, true);
    expect(status).toBe(200);
    const active = body.versions
      .filter((v: { isActive: boolean }) => v.isActive)
      .map((v: { version: string }) => v.version);
    expect(active).toEqual(["test-csv"]);
    const compiled = (await getActiveModels())
      .map((m) => m.compiled)
      .filter((m) => m.key === "mcintosh-poisson");
    expect(compiled.map((m) => m.version)).toEqual(["test-csv"]);
    // Poisson: P(≥1 in T) = 1 − exp(−λT), λ_M+ = (λ_M + λ_X) × correction (Gallagher et al. 2002;
    // McCloskey et al. 2018): (0.2 + 0.05) × 0.5 per day over 1 day.
    const score = compiled[0]!.score({
      region: "HR-1",
      location: "N10E10",
      areaMsh: 100,
      spotCount: 5,
      mcintosh: "Dkc",
      mountWilson: "beta",
      flares24h: { C: 0, M: 0, X: 0 },
    });
    expect(score.probabilities?.["M+"]["24h"]).toBeCloseTo(1 - Math.exp(-0.125), 12);
    const deactivated = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "model.deactivated"));
    expect(deactivated.map((a) => (a.details as { version: string }).version)).toEqual(["demo-1"]);
  });

  it("deactivating leaves the key without an active version", async () => {
    const [csvRow] = await getDb().select().from(models).where(eq(models.version, "test-csv"));
    expect((await activate(csvRow!.id, false)).status).toBe(200);
    expect((await getActiveModels()).some((m) => m.compiled.key === "mcintosh-poisson")).toBe(
      false,
    );
    expect((await activate(999999, true)).status).toBe(404);
  });

  it("lists every version, demo ones marked", async () => {
    const { body } = await callRoute(GET, "/api/admin/models", { method: "GET", user: admin });
    expect(body.models.filter((m: { isDemo: boolean }) => m.isDemo)).toHaveLength(
      DEMO_MODELS.length,
    );
    expect(
      body.models
        .filter((m: { key: string }) => m.key === "mcintosh-poisson")
        .map((m: { version: string }) => m.version)
        .sort(),
    ).toEqual(["demo-1", "test-csv", "test-json"]);
  });
});
