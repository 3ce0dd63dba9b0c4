import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET } from "@/pages/api/admin/models/index";
import { seedDemoModels } from "@/server/forecast/models.db";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callRoute, countRows, createActor } from "./api-call";
import { importModel as send, PROVENANCE, RATE_CSV, demoRateParams } from "./models-fixture";

let admin: CurrentUser;
const importModel = (body: Record<string, unknown>, user: CurrentUser = admin) => send(body, user);
const demoParams = demoRateParams();

beforeAll(async () => {
  await useTestDatabase();
  await seedDemoModels();
  admin = await createActor("admin", "admin@halden.example");
});
afterAll(closeTestDatabase);

describe("importing a version", () => {
  it("stores valid JSON inactive and audits it", async () => {
    const { status, body } = await importModel({
      key: "mcintosh-poisson",
      version: "test-json",
      kind: "mcintosh-poisson",
      name: "Rates",
      provenance: PROVENANCE,
      params: demoParams,
    });
    expect(status).toBe(201);
    expect(body).toMatchObject({
      key: "mcintosh-poisson",
      version: "test-json",
      isActive: false,
      isDemo: false,
      provenance: PROVENANCE,
    });
    const audit = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "model.imported"));
    expect(audit.map((a) => a.targetId)).toEqual([String(body.id)]);
  });

  it("refuses invalid parameters with field errors, storing nothing", async () => {
    const before = await countRows("models");
    const bad = structuredClone(demoParams);
    bad.rates.Dkc!.M = -1;
    const { status, body } = await importModel({
      key: "mcintosh-poisson",
      version: "test-bad",
      kind: "mcintosh-poisson",
      name: "Rates",
      provenance: PROVENANCE,
      params: bad,
    });
    expect(status).toBe(400);
    expect(body.error.fields).toEqual({ "params.rates.Dkc.M": "Rates cannot be negative" });
    expect(await countRows("models")).toBe(before);
  });

  it("requires a provenance of at least 10 characters", async () => {
    const { status, body } = await importModel({
      key: "mcintosh-poisson",
      version: "test-prov",
      kind: "mcintosh-poisson",
      name: "Rates",
      provenance: "a table",
      params: demoParams,
    });
    expect(status).toBe(400);
    expect(Object.keys(body.error.fields)).toEqual(["provenance"]);
  });

  it("answers 409 for a key and version already stored", async () => {
    const before = await countRows("models");
    const { status, body } = await importModel({
      key: "mcintosh-poisson",
      version: "test-json",
      kind: "mcintosh-poisson",
      name: "Again",
      provenance: PROVENANCE,
      params: demoParams,
    });
    expect(status).toBe(409);
    expect(body.error.fields).toEqual({ version: "This version exists already." });
    expect(await countRows("models")).toBe(before);
  });

  it("refuses a forecaster", async () => {
    const forecaster = await createActor("forecaster", "forecaster@halden.example");
    expect(
      (
        await importModel(
          {
            key: "x-model",
            version: "1",
            kind: "persistence",
            name: "X",
            provenance: PROVENANCE,
            params: {},
          },
          forecaster,
        )
      ).status,
    ).toBe(403);
    expect(
      (await callRoute(GET, "/api/admin/models", { method: "GET", user: forecaster })).status,
    ).toBe(403);
  });
});

describe("CSV tables", () => {
  it("turns a rate table into rates and Zurich fallbacks", async () => {
    const { status, body } = await importModel({
      format: "csv",
      key: "mcintosh-poisson",
      version: "test-csv",
      kind: "mcintosh-poisson",
      name: "CSV rates",
      provenance: PROVENANCE,
      csv: RATE_CSV,
      correctionFactor: "0.5",
    });
    expect(status).toBe(201);
    expect(body.isActive).toBe(false);
    expect(body.params.rates).toEqual({ Dkc: { C: 0.9, M: 0.2, X: 0.05 } });
    expect(Object.keys(body.params.zurichRates)).toEqual(["A", "B", "C", "D", "E", "F", "H"]);
    expect(body.params.correctionFactor).toBe(0.5);
  });

  it("names the cell that is not a number and stores nothing", async () => {
    const before = await countRows("models");
    const csv = RATE_CSV.replace("Dkc,0.9,0.2", "Dkc,0.9,abc");
    const { status, body } = await importModel({
      format: "csv",
      key: "mcintosh-poisson",
      version: "test-csv-bad",
      kind: "mcintosh-poisson",
      name: "CSV rates",
      provenance: PROVENANCE,
      csv,
      correctionFactor: 0.5,
    });
    expect(status).toBe(400);
    expect(body.error.fields).toEqual({ "csv.8.M": 'Row 8, M: "abc" is not a number.' });
    expect(await countRows("models")).toBe(before);
  });
});
