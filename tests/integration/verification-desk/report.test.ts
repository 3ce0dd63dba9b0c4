import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET as reportRoute } from "@/pages/api/verification/report";
import { GET as sourcesRoute } from "@/pages/api/verification/sources";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { insertReportSample, MODEL, reportQuery as query } from "./report-sample";
import { callJson, createPerson } from "./route-call";

let verifier: CurrentUser;
let dutyOfficer: CurrentUser;
let subscriber: CurrentUser;

const report = (extra: Record<string, string> = {}, user: CurrentUser | null = verifier) =>
  callJson(reportRoute, `/api/verification/report?${query(extra)}`, { user });

beforeAll(async () => {
  await useTestDatabase();
  verifier = await createPerson("verifier", "verifier@report.example");
  dutyOfficer = await createPerson("duty_officer", "duty@report.example");
  subscriber = await createPerson("subscriber", "subscriber@report.example");
  await insertReportSample();
});
afterAll(closeTestDatabase);

describe("the report on a hand-checkable sample", () => {
  it("scores the forecasters beside the model on the same four cases", async () => {
    const { status, body } = await report();
    expect(status).toBe(200);
    expect(body.sample).toMatchObject({ n: 4, events: 2, baseRate: 0.5 });
    expect(body.scores.brier.value).toBeCloseTo(0.2175, 12);
    expect(body.scores.bssClimatology.value).toBeCloseTo(0.13, 12);
    // Against the constant 0.5 reference, BS_ref = 0.25: BSS = 1 − 0.2175/0.25 (Wilks).
    expect(body.scores.bssReference.value).toBeCloseTo(0.13, 12);
    expect(body.scores.rocArea.value).toBeCloseTo(0.75, 12);
    expect(body.contingency.table).toEqual({
      hits: 1,
      falseAlarms: 1,
      misses: 1,
      correctNegatives: 1,
    });
    expect(body.comparison).toMatchObject({ n: 4, events: 2 });
    expect(body.comparison.reference.brier.value).toBeCloseTo(0.25, 12);
    expect(body.timeline.points).toHaveLength(4);
  });

  it("counts only the region's own flares for region forecasts", async () => {
    const { body } = await report({ scope: "region", reference: "" });
    // HR-0700 forecasts: the C8 is below M1, the M3 falls on issue 3; the M1.2 belongs to HR-0701.
    expect(body.sample).toMatchObject({ n: 4, events: 1 });
    expect(body.scores.bssReference).toEqual({
      value: null,
      reason: "no reference forecast chosen",
    });
  });

  it("switches the level thresholds to legacy-scaled flux: M1.2 true is 0.84e-5 legacy, no longer M+", async () => {
    const { body } = await report({ convention: "legacy" });
    expect(body.sample.events).toBe(1);
    expect(body.notes.join(" ")).toMatch(/legacy-scaled flux/);
  });

  it("says 'undefined' with a reason when the period has no events, never NaN", async () => {
    const { body } = await report({ level: "X" });
    expect(body.sample).toMatchObject({ n: 0, events: 0 });
    expect(body.scores.brier).toEqual({ value: null, reason: "the sample is empty" });
    const empty = await report({ level: "M+", from: "2031-07-04", to: "2031-07-04" });
    expect(empty.body.sample).toMatchObject({ n: 1, events: 0 });
    expect(empty.body.scores.bssClimatology.reason).toMatch(/no observed events/);
    expect(empty.body.contingency.scores.pod.value).toBeNull();
  });

  it("is readable by a duty officer, not by a subscriber, and refuses bad filters", async () => {
    expect((await report({}, dutyOfficer)).status).toBe(200);
    expect((await report({}, subscriber)).status).toBe(403);
    expect((await report({}, null)).status).toBe(401);
    const bad = await report({ window: "36", threshold: "2" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["threshold", "window"]);
    expect((await report({ reference: "forecaster" })).body.error.fields.reference).toBeDefined();
  });

  it("lists the sources with their records", async () => {
    const { body } = await callJson(sourcesRoute, "/api/verification/sources", { user: verifier });
    expect(body.sources.map((s: { id: string; records: number }) => [s.id, s.records])).toEqual([
      ["forecaster", 8],
      [MODEL, 4],
    ]);
  });
});
