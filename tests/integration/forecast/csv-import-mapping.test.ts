import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET as getMapping, PUT as putMapping } from "@/pages/api/assessments/import-mapping";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callRoute, countRows, createActor } from "./api-call";

let forecaster: CurrentUser;

beforeAll(async () => {
  await useTestDatabase();
  forecaster = await createActor("forecaster", "forecaster@halden.example");
});
afterAll(closeTestDatabase);

const URL = "/api/assessments/import-mapping";
const read = (user: CurrentUser) => callRoute(getMapping, URL, { method: "GET", user });
const save = (user: CurrentUser, body: unknown) =>
  callRoute(putMapping, URL, { method: "PUT", user, body });

describe("the remembered mapping", () => {
  it("starts empty, is saved for the office without empty choices, and is audited", async () => {
    expect((await read(forecaster)).body).toEqual({ mapping: {} });
    const audits = await countRows("audit_events");
    const saved = await save(forecaster, {
      mapping: { region: "AR", areaMsh: "Area (MSH)", notes: "" },
    });
    expect(saved.status).toBe(200);
    expect((await read(forecaster)).body.mapping).toEqual({ region: "AR", areaMsh: "Area (MSH)" });
    expect(await countRows("audit_events")).toBe(audits + 1);
  });

  it("refuses an unknown field and a role that may not import, keeping the saved mapping", async () => {
    expect((await save(forecaster, { mapping: { bogus: "X" } })).status).toBe(400);
    const verifier = await createActor("verifier", "verifier@halden.example");
    expect((await save(verifier, { mapping: { region: "Nr" } })).status).toBe(403);
    expect((await read(verifier)).status).toBe(403);
    expect((await read(forecaster)).body.mapping).toEqual({ region: "AR", areaMsh: "Area (MSH)" });
  });
});
